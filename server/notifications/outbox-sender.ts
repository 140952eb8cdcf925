import type { Transporter } from 'nodemailer';
import addressparser from 'nodemailer/lib/addressparser';
import type { DataSource } from 'typeorm';
import { OutboxAttachment } from './outbox-attachment.entity';
import { OutboxMessage } from './outbox-message.entity';

const BATCH = 25;
const MAX_BACKOFF_SECONDS = 60 * 60;

/** 30 s, 1 min, 2 min … capped at an hour: an outage delays mail, never drops it. */
export const backoffSeconds = (attempts: number) => Math.min(30 * 2 ** Math.max(0, attempts - 1), MAX_BACKOFF_SECONDS);

/**
 * Deliver due outbox messages. Rows are locked with SKIP LOCKED so two
 * instances never take the same message, and a message is marked sent in the
 * transaction that held its lock. The fixed Message-ID lets the receiving end
 * recognise a repeat should a commit fail after the SMTP server accepted.
 */
/** `organizationId` limits the run to one firm's messages (an owner's "run now"). */
export async function deliverOutbox(db: DataSource, transport: Transporter, from: string, organizationId: string | null = null) {
  // The installation's sending address; the firm's name is the display name (a mail queued before that keeps `from` whole).
  const [sender] = addressparser(from, { flatten: true });
  let sent = 0;
  let deferred = 0;
  for (;;) {
    const batch = await db.transaction(async (manager) => {
      const due = await manager
        .createQueryBuilder(OutboxMessage, 'm')
        .where("m.status = 'pending' AND m.next_attempt_at <= now()")
        .andWhere(organizationId ? 'm.organization_id = :organizationId' : 'true', { organizationId })
        .orderBy('m.created_at', 'ASC')
        .limit(BATCH)
        .setLock('pessimistic_write')
        .setOnLocked('skip_locked')
        .getMany();
      for (const message of due) {
        message.attempts += 1;
        try {
          const attachments = await manager.find(OutboxAttachment, { where: { messageId: message.id }, order: { fileName: 'ASC' } });
          await transport.sendMail({
            attachments: attachments.map((a) => ({ filename: a.fileName, contentType: a.contentType, content: a.content })),
            from: message.fromName && sender?.address ? { name: message.fromName, address: sender.address } : from,
            ...(message.replyTo ? { replyTo: message.replyTo } : {}),
            to: message.recipients,
            subject: message.subject,
            text: message.textBody,
            html: message.htmlBody,
            messageId: message.messageId,
          });
          message.status = 'sent';
          message.sentAt = new Date();
          message.lastError = null;
          sent += 1;
        } catch (err) {
          message.lastError = err instanceof Error ? err.message.slice(0, 500) : String(err);
          message.nextAttemptAt = new Date(Date.now() + backoffSeconds(message.attempts) * 1000);
          deferred += 1;
        }
        await manager.save(OutboxMessage, message);
      }
      return due.length;
    });
    if (batch < BATCH || deferred > 0) break;
  }
  const [{ pending }] = await db.query(
    `SELECT count(*)::int AS pending FROM outbox_messages WHERE status = 'pending' AND ($1::uuid IS NULL OR organization_id = $1)`,
    [organizationId],
  );
  return { sent, deferred, pending };
}
