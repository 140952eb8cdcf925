import { In } from 'typeorm';
import type { Role } from '../../shared/auth/roles';
import type { UserView } from '../../shared/users/views';
import type { Scoped } from '../db/scoped';
import { User } from './user.entity';

export type PublicUser = UserView;

/** A person as anyone may see them: never the password hash, token version or calendar secret. */
export const publicUser = (u: User): UserView => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  organizationId: u.organizationId,
  disabled: u.disabled,
  secondStepOn: u.totpEnabledAt !== null,
  createdAt: u.createdAt.toISOString(),
});

/** One of the firm's people, or null when the id names nobody in this firm. */
export async function findPerson(tx: Scoped, id: string): Promise<PublicUser | null> {
  const user = await tx.findOne(User, { id });
  return user ? publicUser(user) : null;
}

/** The firm's active people in these roles (whom staff notices go to). */
export async function activeStaff(tx: Scoped, roles: Role[]): Promise<PublicUser[]> {
  const users = await tx.find(User, { where: { role: In(roles), disabled: false } });
  return users.map(publicUser);
}

/** The names of these people, by id (ids that name nobody in this firm are left out). */
export async function peopleNames(tx: Scoped, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const users = await tx.find(User, { where: { id: In(unique) }, select: { id: true, name: true } });
  return new Map(users.map((u) => [u.id, u.name]));
}
