import type { DataSource } from 'typeorm';
import { Scoped } from './scoped';

/** Who is acting: every service call carries it, so rules can be checked and
 * records can say who did what. */
export type Actor = { userId: string; organizationId: string; role: import('../../shared/auth/roles').Role };

/** Run `work` in one transaction, scoped to the actor's organization. */
export function inOrganization<T>(db: DataSource, organizationId: string, work: (tx: Scoped) => Promise<T>): Promise<T> {
  return db.transaction((manager) => work(new Scoped(manager, organizationId)));
}

/** Read-only work that needs no transaction (saves two round trips on hot read paths). */
export function readInOrganization<T>(db: DataSource, organizationId: string, work: (tx: Scoped) => Promise<T>): Promise<T> {
  return work(new Scoped(db.manager, organizationId));
}
