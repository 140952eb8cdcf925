import type { Actor } from '../db/transaction';
import type { Scoped } from '../db/scoped';
import { AuditEvent } from './audit-event.entity';

/** Append one line to the organization's audit trail, inside the caller's transaction. */
export function recordAudit(
  tx: Scoped,
  actor: Pick<Actor, 'userId'> | null,
  action: string,
  subject: { type: string; id: string },
  details: Record<string, unknown> = {},
) {
  return tx.insert(AuditEvent, { actorUserId: actor?.userId ?? null, action, subjectType: subject.type, subjectId: subject.id, details });
}

/** Several lines at once (one statement), e.g. one per item of a checkout. */
export async function recordAudits(
  tx: Scoped,
  actor: Pick<Actor, 'userId'> | null,
  entries: { action: string; subject: { type: string; id: string }; details?: Record<string, unknown> }[],
) {
  if (!entries.length) return;
  await tx.insertMany(
    AuditEvent,
    entries.map((e) => ({
      actorUserId: actor?.userId ?? null,
      action: e.action,
      subjectType: e.subject.type,
      subjectId: e.subject.id,
      details: e.details ?? {},
    })),
  );
}
