import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import cron, { type ScheduledTask } from 'node-cron';
import type { DataSource } from 'typeorm';
import type { RoutineRunView, RoutinesView } from '../../shared/routines/views';
import type { DatabaseWatch } from '../db/reachability';
import { notFound } from '../http/errors';
import type { Logger } from '../http/logging';
import { pgRunCoordinator } from './pg-run-coordinator';
import type { Routine } from './routine';
import { RoutineRun } from './routine-run.entity';

/** A run as a firm's owner sees it. In the run log a scheduled run's summary counts every firm's work, so it stays out of view. */
const publicRun = (r: RoutineRun, showSummary = r.organizationId !== null): RoutineRunView => ({
  id: r.id,
  trigger: r.trigger,
  scope: r.organizationId ? ('your firm' as const) : ('every firm' as const),
  scheduledFor: r.scheduledFor?.toISOString() ?? null,
  startedAt: r.startedAt.toISOString(),
  finishedAt: r.finishedAt?.toISOString() ?? null,
  status: r.status,
  summary: showSummary ? r.summary : null,
  error: r.error,
});

/** What the scheduler needs around the routines: the database watch (routines pause while it is away), a logger, a run counter. */
export type RoutineSurroundings = {
  watch?: DatabaseWatch;
  log?: Logger;
  onRunFinished?: (routine: string, status: 'succeeded' | 'failed') => void;
};

export class RoutinesService {
  readonly instanceId = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private tasks: ScheduledTask[] = [];

  constructor(
    private readonly db: DataSource,
    readonly definitions: Routine[],
    private readonly surroundings: RoutineSurroundings = {},
  ) {}

  private find(name: string) {
    const routine = this.definitions.find((r) => r.name === name);
    if (!routine) throw notFound(`The routine "${name}"`);
    return routine;
  }

  /** Run one routine now and log it; failures are logged, not thrown, so the schedule carries on. */
  async run(name: string, trigger: 'schedule' | 'manual', scheduledFor: Date | null = null, organizationId: string | null = null) {
    const routine = this.find(name);
    const repo = this.db.getRepository(RoutineRun);
    const run = await repo.save(
      repo.create({ routineName: name, trigger, scheduledFor, instanceId: this.instanceId, startedAt: new Date(), status: 'running', organizationId }),
    );
    const log = this.surroundings.log?.child({ routine: name, runId: run.id });
    try {
      run.summary = await routine.run({ db: this.db, now: new Date(), trigger, organizationId, log });
      run.status = 'succeeded';
    } catch (err) {
      run.status = 'failed';
      run.error = err instanceof Error ? err.message : String(err);
      log?.error({ err }, 'routine failed');
      this.surroundings.watch?.suspect();
    }
    run.finishedAt = new Date();
    this.surroundings.onRunFinished?.(name, run.status);
    // The caller ran it, so it sees what the run did.
    return publicRun(await repo.save(run), true);
  }

  /** Each routine's last run that this firm may see: scheduled runs, and its own manual ones. */
  async list(organizationId: string): Promise<RoutinesView> {
    const last: RoutineRun[] = await this.db
      .getRepository(RoutineRun)
      .createQueryBuilder('r')
      .where('r.organization_id IS NULL OR r.organization_id = :organizationId', { organizationId })
      .distinctOn(['r.job_name'])
      .orderBy('r.job_name')
      .addOrderBy('r.started_at', 'DESC')
      .getMany();
    return {
      items: this.definitions.map((routine) => {
        const lastRun = last.find((r) => r.routineName === routine.name);
        return { name: routine.name, description: routine.description, schedule: routine.schedule, lastRun: lastRun ? publicRun(lastRun) : null };
      }),
    };
  }

  /**
   * Start every routine's cron; each fire runs on exactly one instance (pgRunCoordinator). While the database is away
   * the fires are let pass quietly (the work is still there when it is back); the watch logs the pause and the resumption.
   */
  start() {
    const { watch, log } = this.surroundings;
    const runCoordinator = pgRunCoordinator(this.db, this.instanceId, watch);
    this.tasks = this.definitions.map((routine) =>
      cron.schedule(routine.schedule, (ctx) => this.run(routine.name, 'schedule', ctx.date).then(() => undefined), {
        name: routine.name,
        timezone: routine.timeZone,
        noOverlap: true,
        distributed: true,
        runCoordinator,
        distributedLease: 60 * 60 * 1000,
        logger: log ? cronLogger(log.child({ routine: routine.name })) : undefined,
      }),
    );
  }

  async stop() {
    await Promise.all(this.tasks.map((t) => t.destroy()));
    this.tasks = [];
  }
}

/** node-cron's logger interface over pino. */
const cronLogger = (log: Logger) => ({
  info: (message: string) => log.info(message),
  warn: (message: string) => log.warn(message),
  error: (message: string | Error, err?: Error) => log.error({ err: err ?? message }, typeof message === 'string' ? message : 'scheduler error'),
  debug: (message: string | Error) => log.debug(String(message)),
});
