import { randomUUID } from 'node:crypto';
import type { Scoped } from '../db/scoped';
import { renderMail, type MailContent } from './mail-template';
import { OutboxMessage } from './outbox-message.entity';

/**
 * Queue an e-mail in the caller's transaction. Nothing is sent from a request:
 * if the change rolls back, so does the mail; if SMTP is down, the sender
 * retries later.
 */
export function enqueueMail(tx: Scoped, recipients: string[], content: MailContent) {
  const { subject, text, html } = renderMail(content);
  return tx.insert(OutboxMessage, {
    messageId: `<${randomUUID()}@nestkeeper.local>`,
    recipients,
    subject,
    textBody: text,
    htmlBody: html,
  });
}
