import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../support/test-db';

let t: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  t = await createTestDatabase();
});
afterAll(() => t.drop());

describe('database schema', () => {
  it('matches the entities exactly after the migrations (nothing left for synchronize to do)', async () => {
    const pending = await t.db.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('refuses to change or delete audit events', async () => {
    const [org] = await t.db.query(`INSERT INTO organizations (name, settings) VALUES ('Audit test firm', '{}') RETURNING id`);
    await t.db.query(`INSERT INTO audit_events (organization_id, action, subject_type, subject_id, details) VALUES ($1, 'x', 'y', 'z', '{}')`, [org.id]);
    await expect(t.db.query(`UPDATE audit_events SET action = 'changed'`)).rejects.toThrow(/append-only/);
    await expect(t.db.query(`DELETE FROM audit_events`)).rejects.toThrow(/append-only/);
  });

  it("refuses to change or delete a renter's acceptance of the agreement", async () => {
    // Statement triggers: refused even before any row is touched.
    await expect(t.db.query(`UPDATE agreement_acceptances SET full_name = 'someone else'`)).rejects.toThrow(/append-only/);
    await expect(t.db.query(`DELETE FROM agreement_acceptances`)).rejects.toThrow(/append-only/);
  });
});
