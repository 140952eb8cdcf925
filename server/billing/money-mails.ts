import type { MoneyMailEvent, MoneyMailView } from '../../shared/billing/views';
import type { Scoped } from '../db/scoped';
import { enqueueMail, mailDeliveries, type MailAttachment, type MailTemplate } from '../notifications';
import { MoneyMail } from './money-mail.entity';

type Told = { capturedMinor?: number; releasedMinor?: number; chargedMinor?: number; documentNumber?: string; totalMinor?: number };

/** Queues the customer's mail about a change to their money and keeps what it told, in the change's transaction. */
export async function mailCustomerAbout<Data>(
  tx: Scoped,
  rentalId: string,
  event: MoneyMailEvent,
  told: Told,
  to: string,
  template: MailTemplate<Data>,
  data: Data,
  attachments: MailAttachment[] = [],
) {
  const message = await enqueueMail(tx, [to], template, data, attachments);
  await tx.insert(MoneyMail, {
    rentalId,
    event,
    outboxMessageId: message.id,
    capturedMinor: told.capturedMinor ?? 0,
    releasedMinor: told.releasedMinor ?? 0,
    chargedMinor: told.chargedMinor ?? 0,
    documentNumber: told.documentNumber ?? null,
    totalMinor: told.totalMinor ?? null,
  });
}

/** The rental's money mails, oldest first, each with where its mail stands in the outbox. */
export async function moneyMailViews(tx: Scoped, rentalId: string): Promise<MoneyMailView[]> {
  const rows = await tx.find(MoneyMail, { where: { rentalId }, order: { createdAt: 'ASC' } });
  const deliveries = new Map(
    (
      await mailDeliveries(
        tx,
        rows.map((r) => r.outboxMessageId),
      )
    ).map((d) => [d.id, d]),
  );
  return rows.map((r) => {
    const mail = deliveries.get(r.outboxMessageId);
    return {
      id: r.id,
      event: r.event,
      at: r.createdAt.toISOString(),
      capturedMinor: r.capturedMinor,
      releasedMinor: r.releasedMinor,
      chargedMinor: r.chargedMinor,
      documentNumber: r.documentNumber,
      totalMinor: r.totalMinor,
      sentTo: mail?.recipients ?? [],
      mail: mail?.status === 'sent' ? 'sent' : mail?.status === 'failed' ? 'failed' : 'waiting',
      sentAt: mail?.sentAt?.toISOString() ?? null,
    };
  });
}
