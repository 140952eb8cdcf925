import { randomUUID, type KeyObject } from 'node:crypto';
import { IsNull } from 'typeorm';
import type { AccountSessionView } from '../../shared/auth/views';
import type { Scoped } from '../db/scoped';
import { endSessions } from '../users';
import { signSessionToken, TOKEN_LIFETIME_SECONDS } from './tokens';
import { UserSession } from './user-session.entity';

/** Opens a session row and signs its token (`jti` = the row's id), in the caller's transaction. */
export async function openSession(tx: Scoped, key: KeyObject, who: { userId: string; tokenVersion: number }, userAgent: string | undefined) {
  const id = randomUUID();
  await tx.insert(UserSession, { id, userId: who.userId, userAgent: (userAgent ?? '').slice(0, 300), lastSeenAt: new Date() });
  return signSessionToken(key, { sub: who.userId, org: tx.organizationId, ver: who.tokenVersion, jti: id });
}

/** The person's sessions that still work: not ended and younger than a token lives. */
export async function liveSessions(tx: Scoped, userId: string, currentId: string | undefined): Promise<AccountSessionView[]> {
  const rows = await tx.sql<{ id: string; user_agent: string; created_at: Date; last_seen_at: Date }>(
    `SELECT id, user_agent, created_at, last_seen_at FROM user_sessions
      WHERE organization_id = $1 AND user_id = $2 AND ended_at IS NULL AND created_at > now() - $3 * interval '1 second'
      ORDER BY last_seen_at DESC`,
    [userId, TOKEN_LIFETIME_SECONDS],
  );
  return rows.map((r) => ({
    id: r.id,
    device: r.user_agent,
    signedInAt: r.created_at.toISOString(),
    lastSeenAt: r.last_seen_at.toISOString(),
    current: r.id === currentId,
  }));
}

/** Ends one session of this person; false when there is no such live session. */
export async function endOneSession(tx: Scoped, userId: string, sessionId: string): Promise<boolean> {
  const result = await tx.updateWhere(UserSession, { id: sessionId, userId, endedAt: IsNull() }, { endedAt: new Date() });
  return (result.affected ?? 0) > 0;
}

/** Ends every session and token of this person: the rows close and the token version moves on (bearer tokens too). */
export async function endEverySession(tx: Scoped, userId: string) {
  await tx.updateWhere(UserSession, { userId, endedAt: IsNull() }, { endedAt: new Date() });
  await endSessions(tx, userId);
}
