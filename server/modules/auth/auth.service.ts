import type { DataSource, EntityManager } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { User } from '../../db/entities/user.entity';
import { PasswordReset } from '../../db/entities/password-reset.entity';
import { ConflictError, InvalidError, NotFoundError } from '../../errors';
import type { MailService } from '../../services/mail';
import { escapeHtml } from '../../services/mail';
import { hashPassword, hashToken, newToken, verifyPassword } from './password';
import { endAllSessions } from './sessions.service';
import type { ChangePasswordInput, ResetConfirmInput, SetupInput } from '../../../shared/schemas/auth';

const RESET_TTL_MS = 3600 * 1000;

export function publicUser(u: User) {
  return { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin };
}

/** Marks every outstanding reset link of the user as used: after a reset or a password change none of them works. */
async function invalidateResets(m: EntityManager, userId: number): Promise<void> {
  await m.update(PasswordReset, { user: { id: userId }, usedAt: IsNull() }, { usedAt: new Date() });
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

  /**
   * Makes a reset link and mails it, when the address has an account; answers whether it had one. The
   * router answers the request before calling this (so the answer's timing does not reveal accounts);
   * the answer never depends on what this returns.
   */
  async requestReset(email: string): Promise<User | null> {
    const user = await this.ds.getRepository(User).findOneBy({ email });
    if (!user) return null;
    const { token, hash } = newToken();
    await this.ds.getRepository(PasswordReset).save({ user, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS), usedAt: null });
    const link = `${this.publicUrl}/reset/${token}`;
    await this.mail.send({
      to: user.email,
      subject: 'Reset your Grisaille password',
      text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Grisaille account. Open this link within one hour to choose a new one:\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
      html: `<p>Hello ${escapeHtml(user.name)},</p><p>Someone asked to reset the password of your Grisaille account. Open this link within one hour to choose a new one:</p><p><a href="${link}">${link}</a></p><p>If it was not you, ignore this message; your password stays as it is.</p>`,
    });
    return user;
  }

  /**
   * Sets the new password from a reset link; every other outstanding link of the account stops working
   * and the account is signed out everywhere (by the sessions' userId column, an exact match).
   */
  async confirmReset(input: ResetConfirmInput): Promise<User> {
    return this.ds.transaction(async (m) => {
      const reset = await m.findOne(PasswordReset, {
        where: { tokenHash: hashToken(input.token), usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
        relations: { user: true },
      });
      if (!reset) throw new InvalidError('This reset link is invalid, used or expired; ask for a new one.', 'token');
      reset.user.passwordHash = await hashPassword(input.password);
      await m.save(reset.user);
      await invalidateResets(m, reset.user.id); // this link and every other one
      await endAllSessions(m, reset.user.id);
      return reset.user;
    });
  }

  /**
   * A signed-in user's password change: the current password must match (400 naming currentPassword).
   * Outstanding reset links stop working and every session of the user ends; the router then signs the
   * current browser in again on a fresh session id.
   */
  async changePassword(userId: number, input: ChangePasswordInput): Promise<User> {
    const user = await this.ds.getRepository(User).findOneBy({ id: userId });
    if (!user) throw new NotFoundError('Your account');
    if (!(await verifyPassword(input.currentPassword, user.passwordHash))) {
      throw new InvalidError('That is not your current password.', 'currentPassword');
    }
    const passwordHash = await hashPassword(input.newPassword);
    return this.ds.transaction(async (m) => {
      await m.update(User, { id: user.id }, { passwordHash });
      await invalidateResets(m, user.id);
      await endAllSessions(m, user.id);
      user.passwordHash = passwordHash;
      return user;
    });
  }
}
