import { randomUUID } from 'node:crypto';
import { In, type DataSource } from 'typeorm';
import type { Scoped } from '../db/scoped';
import { renderMail, type MailContent } from './mail-template';
import { OutboxAttachment } from './outbox-attachment.entity';
import { OutboxMessage } from './outbox-message.entity';

export type MailAttachment = { fileName: string; contentType: string; content: Buffer };

/**
 * Queue an e-mail in the caller's transaction. Nothing is sent from a request:
 * if the change rolls back, so does the mail; if SMTP is down, the sender
 * retries later.
 */
export async function enqueueMail(tx: Scoped, recipients: string[], content: MailContent, attachments: MailAttachment[] = []) {
  const { subject, text, html } = renderMail(content);
  const message = await tx.insert(OutboxMessage, {
    messageId: `<${randomUUID()}@nestkeeper.local>`,
    recipients,
    subject,
    textBody: text,
    htmlBody: html,
  });
  if (attachments.length)
    await tx.manager.insert(
      OutboxAttachment,
      attachments.map((a) => ({ ...a, messageId: message.id })),
    );
  return message;
}

/** Mail not yet sent, across every firm, and how long the oldest has waited (the operator's metrics). */
export async function outboxBacklog(db: DataSource): Promise<{ waiting: number; oldestAgeSeconds: number }> {
  const [row]: { waiting: string; oldest: number | null }[] = await db.query(
    `SELECT count(*) AS waiting, extract(epoch FROM now() - min(created_at))::float8 AS oldest FROM outbox_messages WHERE status = 'pending'`,
  );
  return { waiting: Number(row.waiting), oldestAgeSeconds: row.oldest ?? 0 };
}

/** Where queued messages stand: their recipients, and when each was sent (null while waiting). */
export async function mailDeliveries(tx: Scoped, messageIds: string[]) {
  if (!messageIds.length) return [];
  const rows = await tx.find(OutboxMessage, { where: { id: In(messageIds) } });
  return rows.map((m) => ({ id: m.id, recipients: m.recipients, status: m.status, sentAt: m.sentAt }));
}
