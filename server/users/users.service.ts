import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { passwordWeakness } from '../../shared/auth/password-strength';
import type { Page } from '../../shared/lists/page';
import type { createUserPayload, updateUserPayload } from '../../shared/schemas/users';
import type { Role } from '../../shared/auth/roles';
import type { StaffMemberView, UserView } from '../../shared/users/views';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { replacePasswordHash } from './accounts';
import { activeStaff, publicUser } from './people';
import { User } from './user.entity';

/** The firm's active owners, row-locked until the transaction ends (in id order, so two callers cannot deadlock). */
const lockActiveOwners = (tx: Scoped) =>
  tx.sql<{ id: string }>(`SELECT id FROM users WHERE organization_id = $1 AND role = 'owner' AND NOT disabled ORDER BY id FOR UPDATE`);

export class UsersService {
  constructor(
    private readonly db: DataSource,
    private readonly bcryptCost: number,
  ) {}

  hashPassword(password: string) {
    return bcrypt.hash(password, this.bcryptCost);
  }

  /** Refuses (400 on `field`, in plain words) a password a guesser would try early for this person and firm. */
  async refuseGuessable(organizationId: string, password: string, field: string, person: Pick<User, 'email' | 'name'>) {
    const firm = await inOrganization(this.db, organizationId, (tx) => loadOrgContext(tx));
    const weakness = await passwordWeakness(password, [person.email, person.name, firm.name]);
    if (weakness) throw new AppError(400, 'invalid_input', 'That password is too easy to guess.', { fields: { [field]: weakness } });
  }

  /** The firm's active people in these roles, by name: anyone who books or hands over picks from them. */
  staff(actor: Actor, roles: Role[]): Promise<Page<StaffMemberView>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const people = (await activeStaff(tx, roles)).sort((a, b) => a.name.localeCompare(b.name));
      return { items: people.map(({ id, name, role }) => ({ id, name, role })), total: people.length };
    });
  }

  list(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<UserView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [rows, total] = await tx.findAndCount(User, { order: { name: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items: rows.map(publicUser), total };
    });
  }

  async create(actor: Actor, input: z.infer<typeof createUserPayload>) {
    await this.refuseGuessable(actor.organizationId, input.password, 'password', input);
    const passwordHash = await this.hashPassword(input.password);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      // E-mail is the sign-in name across all firms, so check beyond this organization.
      if (await tx.manager.exists(User, { where: { email: input.email } })) {
        throw conflict('Someone already signs in with that e-mail address.', { fields: { email: 'is already in use' } });
      }
      const user = await tx.insert(User, { email: input.email, name: input.name, role: input.role, passwordHash });
      await recordAudit(tx, actor, 'user.created', { type: 'user', id: user.id }, { email: user.email, role: user.role });
      return publicUser(user);
    });
  }

  update(actor: Actor, id: string, patch: z.infer<typeof updateUserPayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      // Locked before anything is read: two owners demoting each other at once would otherwise
      // each count the other and leave the firm with none. The second waits, then counts again.
      const owners = patch.role !== undefined || patch.disabled === true ? await lockActiveOwners(tx) : [];
      const user = await tx.get(User, { id }, 'That user');
      const before = { name: user.name, role: user.role, disabled: user.disabled };
      const losesOwner = user.role === 'owner' && !user.disabled && ((patch.role && patch.role !== 'owner') || patch.disabled === true);
      if (losesOwner && owners.length <= 1) throw ruleBroken('last_owner', 'The firm needs at least one active owner; make someone else owner first.');
      Object.assign(user, patch);
      if (patch.disabled === true && !before.disabled) user.tokenVersion += 1;
      const saved = await tx.save(User, user);
      await recordAudit(tx, actor, 'user.updated', { type: 'user', id }, { before, after: patch });
      return publicUser(saved);
    });
  }

  async resetPassword(actor: Actor, id: string, password: string) {
    const person = await readInOrganization(this.db, actor.organizationId, (tx) => tx.get(User, { id }, 'That user'));
    await this.refuseGuessable(actor.organizationId, password, 'password', person);
    const passwordHash = await this.hashPassword(password);
    await inOrganization(this.db, actor.organizationId, async (tx) => {
      await replacePasswordHash(tx, id, passwordHash);
      await recordAudit(tx, actor, 'user.password_reset', { type: 'user', id });
    });
  }
}
