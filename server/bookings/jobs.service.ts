import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { jobPayload } from '../../shared/schemas/bookings';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict } from '../http/errors';
import { User } from '../users/user.entity';
import { Job } from './job.entity';

type JobInput = z.infer<typeof jobPayload>;

/** Customer site jobs: what a booking is for when the firm measures for a customer. */
export class JobsRegisterService {
  constructor(private readonly db: DataSource) {}

  list(actor: Actor, paging: { limit: number; offset: number }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Job, { order: { startsOn: 'DESC' }, take: paging.limit, skip: paging.offset });
      return { items, total };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, (tx) => tx.get(Job, { id }, 'That job'));
  }

  create(actor: Actor, input: JobInput) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (await tx.count(Job, { reference: input.reference })) throw conflict(`Job ${input.reference} already exists.`, { fields: { reference: 'is already used by another job' } });
      await this.checkLead(tx, input);
      const job = await tx.insert(Job, { ...this.fields(input) });
      await recordAudit(tx, actor, 'job.created', { type: 'job', id: job.id }, { reference: job.reference });
      return job;
    });
  }

  update(actor: Actor, id: string, input: JobInput) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const job = await tx.get(Job, { id }, 'That job');
      if (input.reference !== job.reference && (await tx.count(Job, { reference: input.reference }))) throw conflict(`Job ${input.reference} already exists.`, { fields: { reference: 'is already used by another job' } });
      await this.checkLead(tx, input);
      Object.assign(job, this.fields(input));
      await recordAudit(tx, actor, 'job.updated', { type: 'job', id }, { reference: job.reference });
      return tx.save(Job, job);
    });
  }

  /** The lead technician is one of the firm's people (another firm's user is simply not found). */
  private async checkLead(tx: Scoped, input: JobInput) {
    if (input.leadTechnicianId) await tx.get(User, { id: input.leadTechnicianId }, 'That lead technician');
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
    };
  }
}
