import type { KeyObject } from 'node:crypto';
import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import type { AccountSessionView, SessionView, SignInView } from '../../shared/auth/views';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, notFound, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { accountByEmail, findPerson, ownAccount, replacePasswordHash, type Account } from '../users';
import type { UsersService } from '../users/users.service';
import { endEverySession, endOneSession, liveSessions, openSession } from './sessions';
import type { SecondStep } from './second-step';
import { readSecondStepTicket, SECOND_STEP_TICKET_SECONDS, signSecondStepTicket } from './tokens';

const wrongCredentials = () => new AppError(401, 'unauthenticated', 'That e-mail and password do not match an active account.');
const wrongCode = () => new AppError(401, 'unauthenticated', 'That code is not right, or it was used already. Type the code your app shows now.');
const staleTicket = () => new AppError(401, 'unauthenticated', 'The sign-in took too long; enter your e-mail and password again.');

export class AuthService {
  /** Compared against when the e-mail is unknown, so both failures take as long. */
  private readonly decoyHash: Promise<string>;

  constructor(
    private readonly db: DataSource,
    private readonly users: UsersService,
    private readonly key: KeyObject,
    private readonly secondStep: SecondStep,
  ) {
    this.decoyHash = users.hashPassword('decoy-password-never-used');
  }

  /** The password step. Someone with a second step gets a short-lived ticket for the code step instead of a session. */
  async login(email: string, password: string, userAgent: string | undefined): Promise<SignInView> {
    const account = await accountByEmail(this.db, email);
    const matches = await bcrypt.compare(password, account?.passwordHash ?? (await this.decoyHash));
    if (!account || !matches || account.user.disabled) throw wrongCredentials();
    if (account.user.secondStepOn) {
      const ticket = signSecondStepTicket(this.key, { sub: account.user.id, org: account.user.organizationId, ver: account.tokenVersion });
      return { secondStep: { ticket, expiresAt: new Date(Date.now() + SECOND_STEP_TICKET_SECONDS * 1000).toISOString() } };
    }
    return this.signIn(account, userAgent, 'password');
  }

  /** The code step: a code from the app or an unused recovery code, for the person the ticket names. */
  async loginWithCode(ticket: string, code: string, userAgent: string | undefined): Promise<SignInView & { token: string }> {
    const claims = readSecondStepTicket(this.key, ticket);
    if (!claims) throw staleTicket();
    return inOrganization(this.db, claims.org, async (tx) => {
      const { user, tokenVersion } = await ownAccount(tx, claims.sub);
      if (user.disabled || tokenVersion !== claims.ver) throw staleTicket();
      const how = await this.secondStep.spend(tx, user.id, code);
      if (!how) throw wrongCode();
      const token = await openSession(tx, this.key, { userId: user.id, tokenVersion }, userAgent);
      await recordAudit(tx, { userId: user.id }, 'user.signed_in', { type: 'user', id: user.id }, { with: how });
      return { token, user };
    });
  }

  /** A session for someone whose identity is settled (password, invitation accepted). */
  signIn(account: Pick<Account, 'user' | 'tokenVersion'>, userAgent: string | undefined, how: string) {
    const { user } = account;
    return inOrganization(this.db, user.organizationId, async (tx) => {
      const token = await openSession(tx, this.key, { userId: user.id, tokenVersion: account.tokenVersion }, userAgent);
      await recordAudit(tx, { userId: user.id }, 'user.signed_in', { type: 'user', id: user.id }, { with: how });
      return { token, user };
    });
  }

  /** Ends this sign-in (the caller's token, cookie or bearer); other devices stay signed in. */
  signOut(actor: Actor) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (actor.sessionId) await endOneSession(tx, actor.userId, actor.sessionId);
      await recordAudit(tx, actor, 'user.signed_out', { type: 'user', id: actor.userId });
    });
  }

  /** "Sign out everywhere": every session and token of the caller ends, this one too. */
  signOutEverywhere(actor: Actor) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await endEverySession(tx, actor.userId);
      await recordAudit(tx, actor, 'user.signed_out_everywhere', { type: 'user', id: actor.userId });
    });
  }

  sessions(actor: Actor): Promise<AccountSessionView[]> {
    return readInOrganization(this.db, actor.organizationId, (tx) => liveSessions(tx, actor.userId, actor.sessionId));
  }

  endSession(actor: Actor, sessionId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (!(await endOneSession(tx, actor.userId, sessionId))) throw notFound('That session');
      await recordAudit(tx, actor, 'user.session_ended', { type: 'user', id: actor.userId }, { sessionId });
    });
  }

  me(actor: Actor): Promise<SessionView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const user = await findPerson(tx, actor.userId);
      if (!user) throw notFound('Your account');
      const firm = await loadOrgContext(tx);
      const { id, name, locale, timeZone, currency } = firm;
      return { user, organization: { id, name, locale, timeZone, currency }, secondStep: await this.secondStep.state(tx, user, firm.secondStepRequired) };
    });
  }

  /** Older sessions and tokens end; this browser keeps going with a fresh session. */
  async changeOwnPassword(actor: Actor, currentPassword: string, newPassword: string, userAgent: string | undefined) {
    const { user: me } = await readInOrganization(this.db, actor.organizationId, (tx) => ownAccount(tx, actor.userId));
    await this.users.refuseGuessable(actor.organizationId, newPassword, 'newPassword', me);
    const newHash = await this.users.hashPassword(newPassword);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const { passwordHash } = await ownAccount(tx, actor.userId);
      if (!(await bcrypt.compare(currentPassword, passwordHash))) {
        throw ruleBroken('wrong_password', 'Your current password is not right.', { fields: { currentPassword: 'is not your current password' } });
      }
      await endEverySession(tx, actor.userId);
      const tokenVersion = await replacePasswordHash(tx, actor.userId, newHash);
      await recordAudit(tx, actor, 'user.password_changed', { type: 'user', id: actor.userId });
      return openSession(tx, this.key, { userId: actor.userId, tokenVersion }, userAgent);
    });
  }
}
