import type { Scoped } from '../db/scoped';
import { User } from '../users/user.entity';
import type { Role } from '../../shared/auth/roles';
import { In } from 'typeorm';

/** E-mail addresses of the firm's active people in these roles. */
export async function staffAddresses(tx: Scoped, roles: Role[]): Promise<string[]> {
  const users = await tx.find(User, { where: { role: In(roles), disabled: false } });
  return users.map((u) => u.email);
}
