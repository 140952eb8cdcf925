import { conflict } from '../http/errors';
import type { Scoped } from './scoped';

/**
 * A field record made on a phone carries the id the phone gave it, which is also its idempotency key:
 * the phone's outbox may send it again (no reply came back, a background sync fired twice).
 * The transaction-scoped lock makes a resend that races the first send wait, then find the stored record.
 * An id another firm already holds is refused (409) before the insert would collide with it.
 */
export async function claimClientRecordId(tx: Scoped, table: 'field_checks' | 'incidents', id: string): Promise<void> {
  await tx.sql(`SELECT pg_advisory_xact_lock(hashtextextended($1::text || ':' || $2::text, 0))`, [id]);
  const [elsewhere] = await tx.sql(`SELECT 1 FROM ${table} WHERE id = $2 AND organization_id <> $1`, [id]);
  if (elsewhere) throw conflict('That record id is already taken. The phone must give the record a new id.');
}
