import type { Role } from '../../shared/auth/roles';
import type { Scoped } from '../db/scoped';
import { activeStaff } from '../users';

/** E-mail addresses of the firm's active people in these roles. */
export async function staffAddresses(tx: Scoped, roles: Role[]): Promise<string[]> {
  return (await activeStaff(tx, roles)).map((u) => u.email);
}
