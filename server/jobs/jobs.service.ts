import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import cron, { type ScheduledTask } from 'node-cron';
import type { DataSource } from 'typeorm';
import type { JobRunView, ScheduledJobsView } from '../../shared/jobs/views';
import { notFound } from '../http/errors';
import type { JobDefinition } from './job';
import { JobRun } from './job-run.entity';
import { pgRunCoordinator } from './pg-run-coordinator';

/** A run as a firm's owner sees it. In the run log a scheduled run's summary counts every firm's work, so it stays out of view. */
const publicRun = (r: JobRun, showSummary = r.organizationId !== null): JobRunView => ({
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

export class JobsService {
  readonly instanceId = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private tasks: ScheduledTask[] = [];

  constructor(
    private readonly db: DataSource,
    readonly definitions: JobDefinition[],
  ) {}

  private find(name: string) {
    const job = this.definitions.find((j) => j.name === name);
    if (!job) throw notFound(`The scheduled job "${name}"`);
    return job;
  }

  /** Run one job now and log it; failures are logged, not thrown, so the schedule carries on. */
  async run(name: string, trigger: 'schedule' | 'manual', scheduledFor: Date | null = null, organizationId: string | null = null) {
    const job = this.find(name);
    const repo = this.db.getRepository(JobRun);
    const run = await repo.save(repo.create({ jobName: name, trigger, scheduledFor, instanceId: this.instanceId, startedAt: new Date(), status: 'running', organizationId }));
    try {
      run.summary = await job.run({ db: this.db, now: new Date(), trigger, organizationId });
      run.status = 'succeeded';
    } catch (err) {
      run.status = 'failed';
      run.error = err instanceof Error ? err.message : String(err);
    }
    run.finishedAt = new Date();
    // The caller ran it, so it sees what the run did.
    return publicRun(await repo.save(run), true);
  }

  /** Each job's last run that this firm may see: scheduled runs, and its own manual ones. */
  async list(organizationId: string): Promise<ScheduledJobsView> {
    const last: JobRun[] = await this.db
      .getRepository(JobRun)
      .createQueryBuilder('r')
      .where('r.organization_id IS NULL OR r.organization_id = :organizationId', { organizationId })
      .distinctOn(['r.job_name'])
      .orderBy('r.job_name')
      .addOrderBy('r.started_at', 'DESC')
      .getMany();
    return {
      items: this.definitions.map((j) => {
        const lastRun = last.find((r) => r.jobName === j.name);
        return { name: j.name, description: j.description, schedule: j.schedule, lastRun: lastRun ? publicRun(lastRun) : null };
      }),
    };
  }

  /** Start every job's cron; each fire runs on exactly one instance (pgRunCoordinator). */
  start() {
    const runCoordinator = pgRunCoordinator(this.db, this.instanceId);
    this.tasks = this.definitions.map((job) =>
      cron.schedule(job.schedule, (ctx) => this.run(job.name, 'schedule', ctx.date).then(() => undefined), {
        name: job.name,
        timezone: job.timeZone,
        noOverlap: true,
        distributed: true,
        runCoordinator,
        distributedLease: 60 * 60 * 1000,
      }),
    );
  }

  async stop() {
    await Promise.all(this.tasks.map((t) => t.destroy()));
    this.tasks = [];
  }
}
