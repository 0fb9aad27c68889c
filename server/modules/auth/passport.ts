import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { User } from '../../db/entities/user.entity';
import type { AuthService } from './auth.service';
import { shallowCopy, tableCache } from '../../services/cache';

/** Signed-in users kept for deserialisation, and for how long at most (a write to users empties it at once). */
const USERS_KEPT = 1000;
const USER_TTL_MS = 30_000;

/** A passport instance of our own (not the global one), so several apps can live in one test process. */
export function createPassport(ds: DataSource, auth: AuthService): passport.PassportStatic {
  const p = new passport.Passport() as unknown as passport.PassportStatic;
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.checkCredentials(email, password).then((u) => done(null, u ?? false), done);
    }),
  );
  p.serializeUser((user, done) => done(null, (user as User).id));
  // every request with a session reads its user: kept per app (services/cache.ts), emptied by any write to
  // users (a password or name changed, an account removed), each request getting its own copy
  const users = tableCache<number, User>(ds, [User], { max: USERS_KEPT, ttlMs: USER_TTL_MS });
  p.deserializeUser((id: number, done) => {
    users
      .get(id, () => ds.getRepository(User).findOneBy({ id }))
      .then((u) => done(null, u ? shallowCopy(u) : false), done);
  });
  return p;
}
