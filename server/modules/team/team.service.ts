import type { DataSource } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { Membership } from '../../db/entities/membership.entity';
import { Invitation } from '../../db/entities/invitation.entity';
import { User } from '../../db/entities/user.entity';
import { ConflictError, ForbiddenError, InvalidError, NotFoundError } from '../../errors';
import type { MailService } from '../../services/mail';
import { escapeHtml } from '../../services/mail';
import { hashPassword, hashToken, newToken, verifyPassword } from '../auth/password';
import type { AcceptInvitationInput, InvitationCreateInput, MembershipUpdateInput } from '../../../shared/schemas/auth';

const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

function memberView(m: Membership) {
  return { id: m.id, role: m.role, department: m.department, user: { id: m.user.id, name: m.user.name, email: m.user.email }, createdAt: m.createdAt };
}
function invitationView(i: Invitation) {
  return { id: i.id, email: i.email, role: i.role, department: i.department, expiresAt: i.expiresAt, acceptedAt: i.acceptedAt, createdAt: i.createdAt };
}

export class TeamService {
  constructor(private ds: DataSource, private mail: MailService, private publicUrl: string) {}

  async members(productionId: number) {
    const ms = await this.ds.getRepository(Membership).find({
      where: { production: { id: productionId } },
      relations: { user: true },
      order: { department: 'ASC', id: 'ASC' },
    });
    return ms.map(memberView);
  }

  private async member(productionId: number, memberId: number) {
    const m = await this.ds.getRepository(Membership).findOne({
      where: { id: memberId, production: { id: productionId } },
      relations: { user: true, production: true },
    });
    if (!m) throw new NotFoundError('Member');
    return m;
  }

  /** An owner may change roles and departments; the last owner cannot be demoted. */
  async updateMember(productionId: number, memberId: number, input: MembershipUpdateInput) {
    return this.ds.transaction(async (t) => {
      const m = await this.member(productionId, memberId);
      if (input.role && input.role !== 'owner' && m.role === 'owner') {
        const owners = await t.count(Membership, { where: { production: { id: productionId }, role: 'owner' } });
        if (owners <= 1) throw new ConflictError('A production needs at least one owner; make someone else owner first.', 'role');
      }
      if (input.role) m.role = input.role;
      if (input.department) m.department = input.department;
      return memberView(await t.save(m));
    });
  }

  async removeMember(productionId: number, memberId: number) {
    await this.ds.transaction(async (t) => {
      const m = await this.member(productionId, memberId);
      if (m.role === 'owner') {
        const owners = await t.count(Membership, { where: { production: { id: productionId }, role: 'owner' } });
        if (owners <= 1) throw new ConflictError('The last owner cannot be removed.');
      }
      await t.remove(m);
    });
  }

  async invitations(productionId: number) {
    const is = await this.ds.getRepository(Invitation).find({ where: { production: { id: productionId } }, order: { createdAt: 'DESC' } });
    return is.map(invitationView);
  }

  /** Creates a single-use invitation (7 days) and mails its link, plain text and HTML. */
  async invite(inviter: Membership, input: InvitationCreateInput) {
    const productionId = inviter.production.id;
    const existing = await this.ds.getRepository(Membership).findOne({ where: { production: { id: productionId }, user: { email: input.email } } });
    if (existing) throw new ConflictError('That person is already a member of this production.', 'email');
    const { token, hash } = newToken();
    const inv = await this.ds.getRepository(Invitation).save({
      production: inviter.production,
      invitedBy: inviter.user,
      email: input.email,
      role: input.role,
      department: input.department,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
      acceptedAt: null,
    });
    const link = `${this.publicUrl}/invitation/${token}`;
    const pname = inviter.production.name;
    await this.mail.send({
      to: input.email,
      subject: `You are invited to ${pname} on Grisaille`,
      text: `${inviter.user.name} invites you to join "${pname}" on Grisaille as ${input.role} in the ${input.department} department.\n\nAccept within 7 days (the link works once):\n\n${link}\n`,
      html: `<p>${escapeHtml(inviter.user.name)} invites you to join <strong>${escapeHtml(pname)}</strong> on Grisaille as ${input.role} in the ${input.department} department.</p><p>Accept within 7 days (the link works once):</p><p><a href="${link}">${link}</a></p>`,
    });
    return invitationView(inv);
  }

  async revoke(productionId: number, invitationId: number) {
    const res = await this.ds.getRepository(Invitation).delete({ id: invitationId, production: { id: productionId } });
    if (!res.affected) throw new NotFoundError('Invitation');
  }

  private async openInvitation(token: string) {
    const inv = await this.ds.getRepository(Invitation).findOne({
      where: { tokenHash: hashToken(token), acceptedAt: IsNull(), expiresAt: MoreThan(new Date()) },
      relations: { production: true },
    });
    if (!inv) throw new NotFoundError('Invitation (it may be used or expired)');
    return inv;
  }

  async describe(token: string) {
    const inv = await this.openInvitation(token);
    const account = await this.ds.getRepository(User).findOneBy({ email: inv.email });
    return { email: inv.email, role: inv.role, department: inv.department, production: { id: inv.production.id, name: inv.production.name }, hasAccount: !!account, expiresAt: inv.expiresAt };
  }

  /**
   * Accepts an invitation: a new address gets an account (name + password); an existing account proves itself
   * with its password. The membership and the used mark are written in one transaction.
   */
  async accept(token: string, input: AcceptInvitationInput): Promise<{ user: User; productionId: number }> {
    return this.ds.transaction(async (t) => {
      const inv = await t.findOne(Invitation, {
        where: { tokenHash: hashToken(token), acceptedAt: IsNull(), expiresAt: MoreThan(new Date()) },
        relations: { production: true },
      });
      if (!inv) throw new NotFoundError('Invitation (it may be used or expired)');
      let user = await t.findOneBy(User, { email: inv.email });
      if (user) {
        if (!(await verifyPassword(input.password, user.passwordHash))) throw new ForbiddenError('That is not the password of the existing account for this address.');
      } else {
        if (!input.name) throw new InvalidError('name: required', 'name');
        user = await t.save(User, { email: inv.email, name: input.name, passwordHash: await hashPassword(input.password), isAdmin: false });
      }
      const already = await t.findOne(Membership, { where: { user: { id: user.id }, production: { id: inv.production.id } } });
      if (!already) await t.save(Membership, { user, production: inv.production, role: inv.role, department: inv.department });
      inv.acceptedAt = new Date();
      await t.save(inv);
      return { user, productionId: inv.production.id };
    });
  }
}
