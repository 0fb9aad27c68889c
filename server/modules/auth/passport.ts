import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { User } from '../../db/entities/user.entity';
import type { AuthService } from './auth.service';

/** A passport instance of our own (not the global one), so several apps can live in one test process. */
export function createPassport(ds: DataSource, auth: AuthService): passport.PassportStatic {
  const p = new passport.Passport() as unknown as passport.PassportStatic;
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.checkCredentials(email, password).then((u) => done(null, u ?? false), done);
    }),
  );
  p.serializeUser((user, done) => done(null, (user as User).id));
  p.deserializeUser((id: number, done) => {
    ds.getRepository(User)
      .findOneBy({ id })
      .then((u) => done(null, u ?? false), done);
  });
  return p;
}
