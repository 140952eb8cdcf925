import {
  In,
  type DeepPartial,
  type EntityManager,
  type EntityTarget,
  type FindManyOptions,
  type FindOptionsWhere,
  type ObjectLiteral,
  type QueryDeepPartialEntity,
} from 'typeorm';
import { notFound } from '../http/errors';
import type { OrgOwned } from './org-owned';
import { preparedQuery } from './prepared';

/**
 * The one way services touch organization-owned rows. It adds the signed-in
 * user's organization to every read and stamps it on every write, so a
 * feature cannot forget it. Raw SQL goes through `sql`, where `$1` is always
 * the organization id.
 */
export class Scoped {
  constructor(
    readonly manager: EntityManager,
    readonly organizationId: string,
  ) {}

  private where<T extends OrgOwned>(where?: FindOptionsWhere<T> | FindOptionsWhere<T>[]) {
    const org = { organizationId: this.organizationId } as FindOptionsWhere<T>;
    if (Array.isArray(where)) return where.map((w) => ({ ...w, ...org }));
    return { ...(where ?? {}), ...org };
  }

  find<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, options: FindManyOptions<T> = {}) {
    return this.manager.find(entity, { ...options, where: this.where(options.where) });
  }

  findAndCount<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, options: FindManyOptions<T> = {}) {
    return this.manager.findAndCount(entity, { ...options, where: this.where(options.where) });
  }

  findOne<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, where: FindOptionsWhere<T>, options: Omit<FindManyOptions<T>, 'where'> = {}) {
    return this.manager.findOne(entity, { ...options, where: this.where(where) });
  }

  /** The row, or the API's 404 naming `what` — another organization's row is simply not found. */
  async get<T extends OrgOwned & ObjectLiteral>(
    entity: EntityTarget<T>,
    where: FindOptionsWhere<T>,
    what: string,
    options: Omit<FindManyOptions<T>, 'where'> = {},
  ) {
    const row = await this.findOne(entity, where, options);
    if (!row) throw notFound(what);
    return row;
  }

  /** Every row `ids` names (a request's `assetIds`, say), or the 404 naming the first that is not this
   * organization's: an id in a body is not found just as one in the path is, never a 422. */
  async getEach<T extends OrgOwned & ObjectLiteral & { id: string }>(
    entity: EntityTarget<T>,
    ids: readonly string[],
    what: string,
    options: Omit<FindManyOptions<T>, 'where'> = {},
  ): Promise<T[]> {
    const wanted = [...new Set(ids)];
    const rows = wanted.length ? await this.find(entity, { ...options, where: { id: In(wanted) } as FindOptionsWhere<T> }) : [];
    const missing = wanted.find((id) => !rows.some((row) => row.id === id));
    if (missing) throw notFound(`${what} ${missing}`);
    return rows;
  }

  async insert<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, values: DeepPartial<Omit<T, 'organizationId'>>): Promise<T> {
    const row = this.manager.create(entity, { ...values, organizationId: this.organizationId } as DeepPartial<T>);
    return this.manager.save(entity, row);
  }

  /** Insert many rows in chunks (one statement per chunk); returns the generated ids in order. */
  async insertMany<T extends OrgOwned & ObjectLiteral>(
    entity: EntityTarget<T>,
    rows: DeepPartial<Omit<T, 'organizationId'>>[],
    chunk = 1000,
  ): Promise<string[]> {
    const ids: string[] = [];
    for (let i = 0; i < rows.length; i += chunk) {
      const values = rows.slice(i, i + chunk).map((r) => ({ ...r, organizationId: this.organizationId }) as QueryDeepPartialEntity<T>);
      const result = await this.manager.createQueryBuilder().insert().into(entity).values(values).returning('id').execute();
      ids.push(...result.raw.map((r: { id: string }) => String(r.id)));
    }
    return ids;
  }

  /** Save changes to a row this scope loaded; refuses a row of another organization. */
  save<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, row: T): Promise<T> {
    if (row.organizationId !== this.organizationId) throw notFound('That record');
    return this.manager.save(entity, row);
  }

  /** Update every row of this organization that matches `where`. */
  updateWhere<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, where: FindOptionsWhere<T>, values: QueryDeepPartialEntity<T>) {
    return this.manager.update(entity, this.where(where), values);
  }

  count<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, where: FindOptionsWhere<T> = {}) {
    return this.manager.count(entity, { where: this.where(where) });
  }

  /** A query builder already limited to this organization. Add conditions with
   * `andWhere` — a later `where` would replace the organization condition. */
  select<T extends OrgOwned & ObjectLiteral>(entity: EntityTarget<T>, alias: string) {
    return this.manager
      .createQueryBuilder(entity, alias)
      .where(`${alias}.organization_id = :scopeOrganizationId`, { scopeOrganizationId: this.organizationId });
  }

  sql<R = Record<string, unknown>>(text: string, params: unknown[] = []): Promise<R[]> {
    return this.manager.query(text, [this.organizationId, ...params]);
  }

  /** `sql` as a named prepared statement, for queries on the hot paths (see prepared.ts). */
  prepared<R = Record<string, unknown>>(name: string, text: string, params: unknown[] = []): Promise<R[]> {
    return preparedQuery<R>(this.manager, name, text, [this.organizationId, ...params]);
  }
}
