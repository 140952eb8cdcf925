import type { DataSource } from 'typeorm';
import { lapsingAuthorizations } from './billing/lapsing-authorizations';
import { poolUse } from './db/data-source';
import type { DatabaseWatch } from './db/reachability';
import type { Metrics } from './http/metrics';
import { outboxBacklog } from './notifications';

/**
 * The gauges an operator watches beside the request metrics: the database (reachable, pool use), mail waiting in the
 * outbox and its age, and card authorizations about to lapse. Readings that need the database are skipped while it is away.
 */
export function registerOperatorGauges(metrics: Metrics, db: DataSource, watch: DatabaseWatch) {
  const whileReachable =
    <T>(read: () => Promise<T[]>) =>
    async () =>
      watch.reachable ? read() : [];
  metrics.gauge('nestkeeper_database_up', 'Whether this instance last found PostgreSQL answering (1) or not (0)', () => [{ value: watch.reachable ? 1 : 0 }]);
  metrics.gauge(
    'nestkeeper_db_pool_connections',
    "This instance's database pool: connections open, idle, the pool's maximum, and requests waiting for one",
    () => Object.entries(poolUse(db)).map(([state, value]) => ({ value, labels: { state } })),
    ['state'],
  );
  metrics.gauge(
    'nestkeeper_outbox_waiting_messages',
    'E-mails queued and not yet sent (every firm)',
    whileReachable(async () => [{ value: (await outboxBacklog(db)).waiting }]),
  );
  metrics.gauge(
    'nestkeeper_outbox_oldest_waiting_seconds',
    'How long the oldest unsent e-mail has waited',
    whileReachable(async () => [{ value: (await outboxBacklog(db)).oldestAgeSeconds }]),
  );
  metrics.gauge(
    'nestkeeper_card_authorizations_lapsing',
    'Open deposit card authorizations that lapse within the window ahead (hours), every firm',
    whileReachable(async () => (await lapsingAuthorizations(db)).map((w) => ({ value: w.count, labels: { within_hours: String(w.withinHours) } }))),
    ['within_hours'],
  );
}
