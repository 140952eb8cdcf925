import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { createUserPayload, updateUserPayload } from '../../shared/schemas/users';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict, ruleBroken } from '../http/errors';
import { replacePasswordHash } from './accounts';
import { publicUser } from './people';
import { User } from './user.entity';

export class UsersService {
  constructor(
    private readonly db: DataSource,
    private readonly bcryptCost: number,
  ) {}

  hashPassword(password: string) {
    return bcrypt.hash(password, this.bcryptCost);
  }

  list(actor: Actor, paging: { limit: number; offset: number }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [rows, total] = await tx.findAndCount(User, { order: { name: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items: rows.map(publicUser), total };
    });
  }

  async create(actor: Actor, input: z.infer<typeof createUserPayload>) {
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
      const user = await tx.get(User, { id }, 'That user');
      const before = { name: user.name, role: user.role, disabled: user.disabled };
      const losesOwner = user.role === 'owner' && !user.disabled && ((patch.role && patch.role !== 'owner') || patch.disabled === true);
      if (losesOwner) {
        const owners = await tx.count(User, { role: 'owner', disabled: false });
        if (owners <= 1) throw ruleBroken('last_owner', 'The firm needs at least one active owner; make someone else owner first.');
      }
      Object.assign(user, patch);
      if (patch.disabled === true && !before.disabled) user.tokenVersion += 1;
      const saved = await tx.save(User, user);
      await recordAudit(tx, actor, 'user.updated', { type: 'user', id }, { before, after: patch });
      return publicUser(saved);
    });
  }

  async resetPassword(actor: Actor, id: string, password: string) {
    const passwordHash = await this.hashPassword(password);
    await inOrganization(this.db, actor.organizationId, async (tx) => {
      await replacePasswordHash(tx, id, passwordHash);
      await recordAudit(tx, actor, 'user.password_reset', { type: 'user', id });
    });
  }
}
