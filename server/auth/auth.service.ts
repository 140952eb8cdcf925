import type { KeyObject } from 'node:crypto';
import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, notFound, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { accountByEmail, endSessions, findPerson, ownAccount, replacePasswordHash } from '../users';
import type { UsersService } from '../users/users.service';
import type { SessionView, SignInView } from '../../shared/auth/views';
import { signSessionToken } from './tokens';

const wrongCredentials = () => new AppError(401, 'unauthenticated', 'That e-mail and password do not match an active account.');

export class AuthService {
  /** Compared against when the e-mail is unknown, so both failures take as long. */
  private readonly decoyHash: Promise<string>;

  constructor(
    private readonly db: DataSource,
    private readonly users: UsersService,
    private readonly key: KeyObject,
  ) {
    this.decoyHash = users.hashPassword('decoy-password-never-used');
  }

  async login(email: string, password: string): Promise<SignInView> {
    const account = await accountByEmail(this.db, email);
    const matches = await bcrypt.compare(password, account?.passwordHash ?? (await this.decoyHash));
    if (!account || !matches || account.user.disabled) throw wrongCredentials();
    const { user } = account;
    const token = signSessionToken(this.key, { sub: user.id, org: user.organizationId, ver: account.tokenVersion });
    await inOrganization(this.db, user.organizationId, (tx) => recordAudit(tx, { userId: user.id }, 'user.signed_in', { type: 'user', id: user.id }));
    return { token, user };
  }

  /** Ends every token of the caller, the bearer tokens too (not only this browser's cookie): the token version moves on. */
  signOut(actor: Actor) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await endSessions(tx, actor.userId);
      await recordAudit(tx, actor, 'user.signed_out', { type: 'user', id: actor.userId });
    });
  }

  me(actor: Actor): Promise<SessionView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const user = await findPerson(tx, actor.userId);
      if (!user) throw notFound('Your account');
      const { id, name, timeZone, currency } = await loadOrgContext(tx);
      return { user, organization: { id, name, timeZone, currency } };
    });
  }

  async changeOwnPassword(actor: Actor, currentPassword: string, newPassword: string) {
    const { user: me } = await readInOrganization(this.db, actor.organizationId, (tx) => ownAccount(tx, actor.userId));
    await this.users.refuseGuessable(actor.organizationId, newPassword, 'newPassword', me);
    const newHash = await this.users.hashPassword(newPassword);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const { passwordHash } = await ownAccount(tx, actor.userId);
      if (!(await bcrypt.compare(currentPassword, passwordHash))) {
        throw ruleBroken('wrong_password', 'Your current password is not right.', { fields: { currentPassword: 'is not your current password' } });
      }
      const tokenVersion = await replacePasswordHash(tx, actor.userId, newHash);
      await recordAudit(tx, actor, 'user.password_changed', { type: 'user', id: actor.userId });
      return signSessionToken(this.key, { sub: actor.userId, org: actor.organizationId, ver: tokenVersion });
    });
  }
}
