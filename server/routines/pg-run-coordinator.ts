import type { RunCoordinator } from 'node-cron';
import type { DataSource } from 'typeorm';
import type { DatabaseWatch } from '../db/reachability';

/**
 * node-cron's run coordinator backed by PostgreSQL: for each fire, every
 * instance tries to insert the slot's key and only the one whose insert lands
 * runs it. The primary key makes this hold under any race. While the database
 * is away (the watch) no instance runs anything: the fire passes without a claim.
 */
export function pgRunCoordinator(db: DataSource, instanceId: string, watch?: DatabaseWatch): RunCoordinator {
  return {
    async shouldRun(key, ttlMs) {
      if (watch && !watch.reachable) return false;
      const rows: unknown[] = await db
        .query(
          `INSERT INTO job_leases (key, instance_id, claimed_at, expires_at)
         VALUES ($1, $2, now(), now() + make_interval(secs => $3::double precision / 1000))
         ON CONFLICT (key) DO NOTHING RETURNING key`,
          [key, instanceId, ttlMs],
        )
        .catch((err: unknown) => {
          watch?.suspect();
          throw err;
        });
      return rows.length === 1;
    },
  };
}
