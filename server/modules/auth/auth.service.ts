import type { DataSource } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { User } from '../../db/entities/user.entity';
import { PasswordReset } from '../../db/entities/password-reset.entity';
import { SessionRow } from '../../db/entities/session.entity';
import { ConflictError, InvalidError } from '../../errors';
import type { MailService } from '../../services/mail';
import { escapeHtml } from '../../services/mail';
import { hashPassword, hashToken, newToken, verifyPassword } from './password';
import type { ResetConfirmInput, SetupInput } from '../../../shared/schemas/auth';

const RESET_TTL_MS = 3600 * 1000;

export function publicUser(u: User) {
  return { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin };
}

export class AuthService {
  constructor(private ds: DataSource, private mail: MailService, private publicUrl: string) {}

  /** passport-local verify: the user, or null for a wrong e-mail or password (same answer for both) */
  async checkCredentials(email: string, password: string): Promise<User | null> {
    const user = await this.ds.getRepository(User).findOneBy({ email: email.trim().toLowerCase() });
    if (!user) {
      await hashPassword(password); // same cost either way, so timing does not reveal accounts
      return null;
    }
    return (await verifyPassword(password, user.passwordHash)) ? user : null;
  }

  async needsSetup(): Promise<boolean> {
    return (await this.ds.getRepository(User).count()) === 0;
  }

  /** The first account on an empty database becomes site admin; afterwards accounts come by invitation only. */
  async setup(input: SetupInput): Promise<User> {
    return this.ds.transaction(async (m) => {
      if ((await m.count(User)) > 0) throw new ConflictError('This site already has its first account; ask an owner for an invitation.');
      return m.save(User, { email: input.email, name: input.name, passwordHash: await hashPassword(input.password), isAdmin: true });
    });
  }

  /** Always succeeds from the caller's view, so it does not reveal which addresses have accounts. */
  async requestReset(email: string): Promise<void> {
    const user = await this.ds.getRepository(User).findOneBy({ email });
    if (!user) return;
    const { token, hash } = newToken();
    await this.ds.getRepository(PasswordReset).save({ user, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS), usedAt: null });
    const link = `${this.publicUrl}/reset/${token}`;
    await this.mail.send({
      to: user.email,
      subject: 'Reset your Grisaille password',
      text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Grisaille account. Open this link within one hour to choose a new one:\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
      html: `<p>Hello ${escapeHtml(user.name)},</p><p>Someone asked to reset the password of your Grisaille account. Open this link within one hour to choose a new one:</p><p><a href="${link}">${link}</a></p><p>If it was not you, ignore this message; your password stays as it is.</p>`,
    });
  }

  async confirmReset(input: ResetConfirmInput): Promise<User> {
    return this.ds.transaction(async (m) => {
      const reset = await m.findOne(PasswordReset, {
        where: { tokenHash: hashToken(input.token), usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
        relations: { user: true },
      });
      if (!reset) throw new InvalidError('This reset link is invalid, used or expired; ask for a new one.', 'token');
      reset.usedAt = new Date();
      await m.save(reset);
      reset.user.passwordHash = await hashPassword(input.password);
      await m.save(reset.user);
      // sign the account out everywhere
      const rows = await m.find(SessionRow);
      const mine = rows.filter((r) => r.data.includes(`"user":${reset.user.id}`));
      if (mine.length) await m.remove(mine);
      return reset.user;
    });
  }
}
