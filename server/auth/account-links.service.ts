import type { DataSource } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { roleTitles, type Role } from '../../shared/auth/roles';
import type { InvitationLinkView, InvitationView, ResetLinkView } from '../../shared/auth/views';
import type { Page } from '../../shared/lists/page';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, notFound } from '../http/errors';
import { enqueueMail } from '../notifications';
import { loadOrgContext } from '../organizations';
import { accountByEmail, addPerson, emailInUse, findPerson, replacePasswordHash } from '../users';
import type { UsersService } from '../users/users.service';
import { AccountLink, type AccountLinkPurpose } from './account-link.entity';
import { invitationMail, passwordChangedMail, resetMail } from './account-mail';
import type { AuthService } from './auth.service';
import { linkTokenHash, newLinkToken } from './sealing';
import { endEverySession } from './sessions';

const HOUR_MS = 60 * 60 * 1000;
export const INVITATION_HOURS = 72;
export const RESET_HOURS = 1;

/** A new secret (a resent invitation's old link stops working), good for 72 hours from now. */
const freshInvitationLink = () => ({ ...newLinkToken(), expiresAt: new Date(Date.now() + INVITATION_HOURS * HOUR_MS), sentAt: new Date() });

const linkGone = (code: string, message: string) => new AppError(410, code, message);

/**
 * Links mailed to people: invitations (the owner's, 72 h) and password resets (asked for on the
 * sign-in page, 1 h). Each works once; only its SHA-256 is stored; an expired, used or withdrawn
 * link says which.
 */
export class AccountLinksService {
  constructor(
    private readonly db: DataSource,
    private readonly users: UsersService,
    private readonly auth: AuthService,
    private readonly publicUrl: string,
  ) {}

  // ——— invitations ———

  invite(actor: Actor, email: string, role: Role): Promise<InvitationView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (await emailInUse(tx, email)) throw conflict('Someone already signs in with that e-mail address.', { fields: { email: 'is already in use' } });
      const open = await this.openInvitations(tx).andWhere('l.email = :email', { email }).getOne();
      if (open) throw conflict('That address has an invitation already; send it again from the list instead.', { fields: { email: 'is invited already' } });
      const { token, ...fresh } = freshInvitationLink();
      const link = await tx.insert(AccountLink, { purpose: 'invitation', email, role, createdBy: actor.userId, ...fresh });
      await this.mailInvitation(tx, actor, link, token);
      await recordAudit(tx, actor, 'user.invited', { type: 'invitation', id: link.id }, { email, role });
      return this.invitationView(tx, link);
    });
  }

  invitations(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<InvitationView>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const [rows, total] = await this.openInvitations(tx).orderBy('l.sent_at', 'DESC').take(paging.limit).skip(paging.offset).getManyAndCount();
      return { items: await Promise.all(rows.map((l) => this.invitationView(tx, l))), total };
    });
  }

  /** A fresh link and 72 hours more; the link mailed before stops working. */
  resend(actor: Actor, id: string): Promise<InvitationView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const link = await this.openInvitation(tx, id);
      const { token, ...fresh } = freshInvitationLink();
      await tx.updateWhere(AccountLink, { id }, fresh);
      await this.mailInvitation(tx, actor, Object.assign(link, fresh), token);
      await recordAudit(tx, actor, 'user.invitation_resent', { type: 'invitation', id }, { email: link.email });
      return this.invitationView(tx, link);
    });
  }

  withdraw(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const link = await this.openInvitation(tx, id);
      await tx.updateWhere(AccountLink, { id }, { withdrawnAt: new Date() });
      await recordAudit(tx, actor, 'user.invitation_withdrawn', { type: 'invitation', id }, { email: link.email });
    });
  }

  async invitationByToken(token: string): Promise<InvitationLinkView> {
    const link = await this.usableLink(token, 'invitation');
    return readInOrganization(this.db, link.organizationId, async (tx) => ({
      email: link.email,
      role: link.role!,
      firmName: (await loadOrgContext(tx)).name,
      expiresAt: link.expiresAt.toISOString(),
    }));
  }

  /** The invitee chooses name and password; the account is made and they are signed in. */
  async accept(token: string, name: string, password: string, userAgent: string | undefined) {
    const link = await this.usableLink(token, 'invitation');
    await this.users.refuseGuessable(link.organizationId, password, 'password', { email: link.email, name });
    const passwordHash = await this.users.hashPassword(password);
    const user = await inOrganization(this.db, link.organizationId, async (tx) => {
      await this.spend(tx, link);
      const person = await addPerson(tx, { email: link.email, name, role: link.role!, passwordHash });
      await tx.updateWhere(AccountLink, { id: link.id }, { userId: person.id });
      await recordAudit(tx, { userId: person.id }, 'user.invitation_accepted', { type: 'user', id: person.id }, { invitationId: link.id, role: person.role });
      return person;
    });
    return this.auth.signIn({ user, tokenVersion: 0 }, userAgent, 'invitation');
  }

  // ——— password resets ———

  /**
   * Mails a reset link when the address belongs to an active person; otherwise does nothing.
   * The route answers before calling this, so the answer and its timing cannot tell the two apart.
   */
  async requestReset(email: string) {
    const account = await accountByEmail(this.db, email);
    if (!account || account.user.disabled) return;
    await inOrganization(this.db, account.user.organizationId, async (tx) => {
      const firm = await loadOrgContext(tx);
      // A new link replaces any earlier one still unused.
      await tx.updateWhere(
        AccountLink,
        { purpose: 'password_reset', userId: account.user.id, usedAt: IsNull(), withdrawnAt: IsNull() },
        { withdrawnAt: new Date() },
      );
      const { token, tokenHash } = newLinkToken();
      const expiresAt = new Date(Date.now() + RESET_HOURS * HOUR_MS);
      const link = await tx.insert(AccountLink, { purpose: 'password_reset', email, userId: account.user.id, tokenHash, expiresAt, sentAt: new Date() });
      await enqueueMail(tx, [email], resetMail, { firm: firm.name, email, url: `${this.publicUrl}/reset-password#${token}`, expiresAt });
      await recordAudit(tx, null, 'user.password_reset_requested', { type: 'user', id: account.user.id }, { linkId: link.id });
    });
  }

  async resetByToken(token: string): Promise<ResetLinkView> {
    const link = await this.usableLink(token, 'password_reset');
    return { email: link.email, expiresAt: link.expiresAt.toISOString() };
  }

  /** Sets the new password; every session and token of the person ends. They sign in afresh (with their second step, if on). */
  async completeReset(token: string, password: string) {
    const link = await this.usableLink(token, 'password_reset');
    const person = await readInOrganization(this.db, link.organizationId, (tx) => findPerson(tx, link.userId!));
    if (!person || person.disabled) throw linkGone('link_withdrawn', 'This reset link no longer works. Ask your firm’s owner for help.');
    await this.users.refuseGuessable(link.organizationId, password, 'password', person);
    const passwordHash = await this.users.hashPassword(password);
    await inOrganization(this.db, link.organizationId, async (tx) => {
      await this.spend(tx, link);
      await endEverySession(tx, person.id);
      await replacePasswordHash(tx, person.id, passwordHash);
      const firm = await loadOrgContext(tx);
      await enqueueMail(tx, [person.email], passwordChangedMail, { firm: firm.name, email: person.email });
      await recordAudit(tx, { userId: person.id }, 'user.password_reset', { type: 'user', id: person.id }, { linkId: link.id });
    });
  }

  // ——— shared ———

  private openInvitations(tx: Scoped) {
    return tx.select(AccountLink, 'l').andWhere(`l.purpose = 'invitation' AND l.used_at IS NULL AND l.withdrawn_at IS NULL`);
  }

  private async openInvitation(tx: Scoped, id: string) {
    const link = await this.openInvitations(tx).andWhere('l.id = :id', { id }).setLock('pessimistic_write').getOne();
    if (!link) throw notFound('That invitation');
    return link;
  }

  private async mailInvitation(tx: Scoped, actor: Actor, link: AccountLink, token: string) {
    const [firm, inviter] = await Promise.all([loadOrgContext(tx), findPerson(tx, actor.userId)]);
    const url = `${this.publicUrl}/join#${token}`;
    await enqueueMail(tx, [link.email], invitationMail, {
      firm: firm.name,
      inviter: inviter!.name,
      roleTitle: roleTitles[link.role!].toLowerCase(),
      url,
      expiresAt: link.expiresAt,
    });
  }

  private async invitationView(tx: Scoped, link: AccountLink): Promise<InvitationView> {
    const inviter = link.createdBy ? await findPerson(tx, link.createdBy) : null;
    return {
      id: link.id,
      email: link.email,
      role: link.role!,
      state: link.expiresAt.getTime() <= Date.now() ? 'expired' : 'pending',
      sentAt: link.sentAt.toISOString(),
      expiresAt: link.expiresAt.toISOString(),
      invitedBy: inviter?.name ?? null,
    };
  }

  /** The link this secret opens, if it can still be used; otherwise a plain answer saying why not. */
  private async usableLink(token: string, purpose: AccountLinkPurpose): Promise<AccountLink> {
    const link = await this.db.getRepository(AccountLink).findOneBy({ tokenHash: linkTokenHash(token), purpose });
    const what = purpose === 'invitation' ? 'invitation' : 'reset link';
    const again = purpose === 'invitation' ? 'Ask the person who invited you to send a new one.' : 'Ask for a new one from the sign-in page.';
    if (!link) throw new AppError(404, 'link_unknown', `Nestkeeper does not know this ${what}. Check that the whole link was copied. ${again}`);
    if (link.usedAt) throw linkGone('link_used', `This ${what} was used already; it works only once. ${purpose === 'invitation' ? 'Sign in instead.' : again}`);
    if (link.withdrawnAt) throw linkGone('link_withdrawn', `This ${what} was withdrawn. ${again}`);
    if (link.expiresAt.getTime() <= Date.now()) throw linkGone('link_expired', `This ${what} has expired. ${again}`);
    return link;
  }

  /** Marks the link used, once: of two uses at the same moment, the second finds it gone. */
  private async spend(tx: Scoped, link: AccountLink) {
    const { affected } = await tx.updateWhere(
      AccountLink,
      { id: link.id, usedAt: IsNull(), withdrawnAt: IsNull(), expiresAt: MoreThan(new Date()) },
      { usedAt: new Date() },
    );
    if (!affected) throw linkGone('link_used', 'This link was used already; it works only once.');
  }
}
