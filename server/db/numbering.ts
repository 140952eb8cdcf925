import type { Scoped } from './scoped';

/**
 * The next number of a series per organization (rentals, invoices, credit
 * notes), taken inside the caller's transaction: the counter row stays locked
 * until commit, so concurrent issuers queue, and a rollback gives the number
 * back — no gaps, no repeats.
 */
export async function nextNumber(tx: Scoped, series: string): Promise<number> {
  const [row] = await tx.sql<{ last_number: number }>(
    `INSERT INTO document_counters (organization_id, series, last_number) VALUES ($1, $2, 1)
     ON CONFLICT (organization_id, series) DO UPDATE SET last_number = document_counters.last_number + 1
     RETURNING last_number`,
    [series],
  );
  return row.last_number;
}

export const padded = (n: number, width = 4) => String(n).padStart(width, '0');
