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

export type AuditLine = { subjectId: string; at: Date; action: string; actorId: string | null; details: Record<string, unknown> };

/** The audit lines of these actions about these assets in the period (the firm's calendar days), oldest first. */
export function assetAuditLines(
  tx: Scoped,
  assetIds: string[],
  actions: string[],
  period: { from: string | null; to: string | null },
  timeZone: string,
): Promise<AuditLine[]> {
  return tx.sql<AuditLine>(
    `SELECT subject_id AS "subjectId", at, action, actor_user_id AS "actorId", details FROM audit_events
      WHERE organization_id = $1 AND subject_type = 'asset' AND subject_id = ANY($2::text[]) AND action = ANY($3::text[])
        AND ($4::date IS NULL OR (at AT TIME ZONE $6)::date >= $4::date) AND ($5::date IS NULL OR (at AT TIME ZONE $6)::date <= $5::date)
      ORDER BY subject_id, at, id`,
    [assetIds, actions, period.from, period.to, timeZone],
  );
}
