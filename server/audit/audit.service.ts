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
