import { DataSource, type EntityManager, type QueryRunner } from 'typeorm';

/** The node-postgres client or pool under TypeORM's postgres driver (its own types are not exported). */
type PgQueryable = { query: (config: { name: string; text: string; values: unknown[] }) => Promise<{ rows: unknown[] }> };
type PgQueryRunner = QueryRunner & { connect(): Promise<PgQueryable> };

/**
 * Runs a named prepared statement on the hot paths (sign-in check, availability):
 * PostgreSQL plans it once per connection instead of on every request, which
 * for these short queries costs more than running them. Inside a transaction
 * it uses that transaction's connection; otherwise any pooled one.
 */
export async function preparedQuery<R>(manager: EntityManager | DataSource, name: string, text: string, values: unknown[]): Promise<R[]> {
  const runner = manager instanceof DataSource ? undefined : (manager.queryRunner as PgQueryRunner | undefined);
  const source = manager instanceof DataSource ? manager : manager.connection;
  const client = runner?.isTransactionActive && !runner.isReleased ? await runner.connect() : (source.driver as unknown as { master: PgQueryable }).master;
  const result = await client.query({ name, text, values });
  return result.rows as R[];
}
