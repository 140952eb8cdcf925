import type { DataSource } from 'typeorm';
import { Scoped } from './scoped';

/** Services take the actor from here, beside the transaction helpers they pass it into. */
export type { Actor } from '../http/guards';

/** Run `work` in one transaction, scoped to the actor's organization. */
export function inOrganization<T>(db: DataSource, organizationId: string, work: (tx: Scoped) => Promise<T>): Promise<T> {
  return db.transaction((manager) => work(new Scoped(manager, organizationId)));
}

/** Read-only work that needs no transaction (saves two round trips on hot read paths). */
export function readInOrganization<T>(db: DataSource, organizationId: string, work: (tx: Scoped) => Promise<T>): Promise<T> {
  return work(new Scoped(db.manager, organizationId));
}
