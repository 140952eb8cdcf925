import { randomUUID } from 'node:crypto';
import { In, type DataSource } from 'typeorm';
import type { Scoped } from '../db/scoped';
import { loadOrgContext, voiceOf } from '../organizations';
import { renderMail, textOf, type FirmSignature } from './mail-layout';
import type { MailTemplate } from './mail-template';
import { OutboxAttachment } from './outbox-attachment.entity';
import { OutboxMessage } from './outbox-message.entity';

export type MailAttachment = { fileName: string; contentType: string; content: Buffer };

/** The firm a mail speaks for, as its settings say now. */
export async function firmSignature(tx: Scoped): Promise<FirmSignature> {
  const ctx = await loadOrgContext(tx);
  return { name: ctx.name, address: ctx.issuer.address, replyTo: ctx.mailReplyTo, voice: voiceOf(ctx) };
}

/** A letter's subject and words as plain text, for a person to read and edit before it goes out as `letterTemplate`. */
export async function draftLetter<Data>(tx: Scoped, template: MailTemplate<Data>, data: Data): Promise<{ subject: string; text: string }> {
  const { subject, body } = template.render(data, (await firmSignature(tx)).voice);
  return { subject, text: textOf(body) };
}

/**
 * Queue an e-mail in the caller's transaction. Nothing is sent from a request:
 * if the change rolls back, so does the mail; if SMTP is down, the sender
 * retries later. It goes out in the firm's name with its Reply-To as they are now.
 */
export async function enqueueMail<Data>(tx: Scoped, recipients: string[], template: MailTemplate<Data>, data: Data, attachments: MailAttachment[] = []) {
  const firm = await firmSignature(tx);
  const { subject, text, html } = renderMail(template, data, firm);
  const message = await tx.insert(OutboxMessage, {
    messageId: `<${randomUUID()}@nestkeeper.local>`,
    recipients,
    fromName: firm.name,
    replyTo: firm.replyTo || null,
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
/** Where each of these queued messages stands: recipients, status, and when it reached the mail server (null: waiting). */
export async function mailDeliveries(tx: Scoped, messageIds: string[]) {
  if (!messageIds.length) return [];
  const rows = await tx.find(OutboxMessage, { where: { id: In(messageIds) } });
  return rows.map((m) => ({ id: m.id, recipients: m.recipients, status: m.status, sentAt: m.sentAt }));
}
