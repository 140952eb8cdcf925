import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { SiteJobView } from '../../shared/bookings/views';
import type { Page } from '../../shared/lists/page';
import type { jobPayload } from '../../shared/schemas/bookings';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict, notFound } from '../http/errors';
import { findPerson } from '../users';
import { Job } from './job.entity';

type JobInput = z.infer<typeof jobPayload>;

/** The lead technician is one of the firm's people: another firm's user id is not found. */
/** The lead technician must be one of the firm's people: 404 otherwise, like any other id. */
async function leadOf(tx: Scoped, input: JobInput) {
  if (!input.leadTechnicianId) return null;
  const lead = await findPerson(tx, input.leadTechnicianId);
  if (!lead) throw notFound('That lead technician');
  return lead;
}

/** Customer site jobs: what a booking is for when the firm measures for a customer. */
export class JobsRegisterService {
  constructor(private readonly db: DataSource) {}

  list(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<SiteJobView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Job, { order: { startsOn: 'DESC' }, take: paging.limit, skip: paging.offset });
      return { items, total };
    });
  }

  get(actor: Actor, id: string): Promise<SiteJobView> {
    return inOrganization(this.db, actor.organizationId, (tx) => tx.get(Job, { id }, 'That job'));
  }

  create(actor: Actor, input: JobInput): Promise<SiteJobView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await leadOf(tx, input);
      if (await tx.count(Job, { reference: input.reference }))
        throw conflict(`Job ${input.reference} already exists.`, { fields: { reference: 'is already used by another job' } });
      const job = await tx.insert(Job, { ...this.fields(input) });
      await recordAudit(tx, actor, 'job.created', { type: 'job', id: job.id }, { reference: job.reference, tightestTolerance: job.tightestTolerance });
      return job;
    });
  }

  update(actor: Actor, id: string, input: JobInput): Promise<SiteJobView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const job = await tx.get(Job, { id }, 'That job');
      await leadOf(tx, input);
      if (input.reference !== job.reference && (await tx.count(Job, { reference: input.reference })))
        throw conflict(`Job ${input.reference} already exists.`, { fields: { reference: 'is already used by another job' } });
      Object.assign(job, this.fields(input));
      await recordAudit(tx, actor, 'job.updated', { type: 'job', id }, { reference: job.reference, tightestTolerance: job.tightestTolerance });
      return tx.save(Job, job);
    });
  }

  private fields(input: JobInput) {
    return {
      reference: input.reference,
      customerName: input.customerName,
      contactName: input.contactName ?? null,
      contactEmail: input.contactEmail ?? null,
      siteAddress: input.siteAddress ?? null,
      startsOn: input.startsOn,
      endsOn: input.endsOn,
      leadTechnicianId: input.leadTechnicianId ?? null,
      notes: input.notes ?? null,
      tightestTolerance: input.tightestTolerance
        ? { tolerance: input.tightestTolerance.tolerance, distanceM: input.tightestTolerance.distanceM ?? null, note: input.tightestTolerance.note ?? null }
        : null,
    };
  }
}
