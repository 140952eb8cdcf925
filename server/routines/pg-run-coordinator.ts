import type { RunCoordinator } from 'node-cron';
import type { DataSource } from 'typeorm';

/**
 * node-cron's run coordinator backed by PostgreSQL: for each fire, every
 * instance tries to insert the slot's key and only the one whose insert lands
 * runs it. The primary key makes this hold under any race.
 */
export function pgRunCoordinator(db: DataSource, instanceId: string): RunCoordinator {
  return {
    async shouldRun(key, ttlMs) {
      const rows: unknown[] = await db.query(
        `INSERT INTO job_leases (key, instance_id, claimed_at, expires_at)
         VALUES ($1, $2, now(), now() + make_interval(secs => $3::double precision / 1000))
         ON CONFLICT (key) DO NOTHING RETURNING key`,
        [key, instanceId, ttlMs],
      );
      return rows.length === 1;
    },
  };
}
