import type { KeyObject } from 'node:crypto';
import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, ruleBroken } from '../http/errors';
import { Organization } from '../organizations/organization.entity';
import { User } from '../users/user.entity';
import { publicUser, type UsersService } from '../users/users.service';
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
    const user = await this.db
      .getRepository(User)
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email })
      .getOne();
    const matches = await bcrypt.compare(password, user?.passwordHash ?? (await this.decoyHash));
    if (!user || !matches || user.disabled) throw wrongCredentials();
    const token = signSessionToken(this.key, { sub: user.id, org: user.organizationId, ver: user.tokenVersion });
    await inOrganization(this.db, user.organizationId, (tx) => recordAudit(tx, { userId: user.id }, 'user.signed_in', { type: 'user', id: user.id }));
    return { token, user: publicUser(user) };
  }

  /** Ends every token of the caller, the bearer tokens too (not only this browser's cookie): the token version moves on. */
  signOut(actor: Actor) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await tx.updateWhere(User, { id: actor.userId }, { tokenVersion: () => 'token_version + 1' });
      await recordAudit(tx, actor, 'user.signed_out', { type: 'user', id: actor.userId });
    });
  }

  me(actor: Actor): Promise<SessionView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const user = await tx.get(User, { id: actor.userId }, 'Your account');
      const organization = await tx.manager.findOneByOrFail(Organization, { id: actor.organizationId });
      const { id, name, timeZone, currency } = organization;
      return { user: publicUser(user), organization: { id, name, timeZone, currency } };
    });
  }

  async changeOwnPassword(actor: Actor, currentPassword: string, newPassword: string) {
    const me = await readInOrganization(this.db, actor.organizationId, (tx) => tx.get(User, { id: actor.userId }, 'Your account'));
    await this.users.refuseGuessable(actor.organizationId, newPassword, 'newPassword', me);
    const newHash = await this.users.hashPassword(newPassword);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const user = await tx.manager
        .createQueryBuilder(User, 'u')
        .addSelect('u.passwordHash')
        .where('u.id = :id AND u.organization_id = :org', { id: actor.userId, org: actor.organizationId })
        .getOneOrFail();
      if (!(await bcrypt.compare(currentPassword, user.passwordHash))) {
        throw ruleBroken('wrong_password', 'Your current password is not right.', { fields: { currentPassword: 'is not your current password' } });
      }
      user.passwordHash = newHash;
      user.tokenVersion += 1;
      await tx.save(User, user);
      await recordAudit(tx, actor, 'user.password_changed', { type: 'user', id: user.id });
      return signSessionToken(this.key, { sub: user.id, org: user.organizationId, ver: user.tokenVersion });
    });
  }
}
