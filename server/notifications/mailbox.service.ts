import type { DataSource } from 'typeorm';
import type { Page } from '../../shared/lists/page';
import type { MailMessageView } from '../../shared/notifications/views';
import { inOrganization, type Actor } from '../db/transaction';

type MailboxRow = Omit<MailMessageView, 'receivedAt'> & { receivedAt: Date };

/** What the local SMTP sink received, limited to mail this organization sent. */
export function listMailbox(db: DataSource, actor: Actor, paging: { limit: number; offset: number }): Promise<Page<MailMessageView>> {
  return inOrganization(db, actor.organizationId, async (tx) => {
    const items = await tx.sql<MailboxRow>(
      `SELECT s.id, s.message_id AS "messageId", s.envelope_from AS "from", s.recipients AS "to", s.subject,
              s.text_body AS text, s.html_body AS html, coalesce(s.attachments, '[]'::jsonb) AS attachments, s.received_at AS "receivedAt"
         FROM mail_sink_messages s JOIN outbox_messages o ON o.message_id = s.message_id
        WHERE o.organization_id = $1
        ORDER BY s.received_at DESC LIMIT $2 OFFSET $3`,
      [paging.limit, paging.offset],
    );
    const [{ total }] = await tx.sql<{ total: number }>(
      `SELECT count(*)::int AS total FROM mail_sink_messages s JOIN outbox_messages o ON o.message_id = s.message_id WHERE o.organization_id = $1`,
    );
    return { items: items.map((m) => ({ ...m, receivedAt: m.receivedAt.toISOString() })), total };
  });
}
