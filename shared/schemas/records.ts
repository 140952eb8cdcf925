import { z } from 'zod';
import { assetTypes } from './assets';
import { calendarDate } from './common';

/** `?from=&to=` of an equipment record: both optional, both days included. */
export const recordPeriodQuery = z
  .object({ from: calendarDate.optional(), to: calendarDate.optional() })
  .refine((p) => !p.from || !p.to || p.from <= p.to, { message: 'must be on or after the first day', path: ['to'] });

export const auditPackScopes = ['all', 'kit', 'type', 'flagged'] as const;
export type AuditPackScope = (typeof auditPackScopes)[number];

/** An audit pack: a period (both days included, at most about ten years) and which items. */
export const auditPackQuery = z
  .object({
    from: calendarDate,
    to: calendarDate,
    scope: z.enum(auditPackScopes, { message: `must be one of ${auditPackScopes.join(', ')}` }).default('all'),
    kitId: z.uuid('is not a kit id').optional(),
    type: z.enum(assetTypes, { message: 'is not an asset type' }).optional(),
  })
  .superRefine((q, ctx) => {
    if (q.from > q.to) ctx.addIssue({ code: 'custom', message: 'must be on or after the first day', path: ['to'] });
    if (q.scope === 'kit' && !q.kitId) ctx.addIssue({ code: 'custom', message: 'pick a kit', path: ['kitId'] });
    if (q.scope === 'type' && !q.type) ctx.addIssue({ code: 'custom', message: 'pick a type', path: ['type'] });
  });
export type AuditPackQuery = z.infer<typeof auditPackQuery>;
