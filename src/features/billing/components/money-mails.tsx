import type { MoneyMailEvent, MoneyMailView } from '../../../../shared/billing/views';
import { formatMoney, useFirmFormat } from '../../../lib/format';

/** What the change did, in the words the confirmation used. */
function whatHappened(m: MoneyMailView, money: (minor: number) => string): string {
  const parts = [
    m.capturedMinor ? `${money(m.capturedMinor)} captured` : '',
    m.chargedMinor ? `${money(m.chargedMinor)} charged to the saved card` : '',
    m.releasedMinor ? `${money(m.releasedMinor)} released` : '',
  ].filter(Boolean);
  if (m.event === 'invoice_issued') return `Invoice ${m.documentNumber} (${money(m.totalMinor ?? 0)}) issued`;
  if (m.event === 'credit_note_issued') return `Credit note ${m.documentNumber} (${money(Math.abs(m.totalMinor ?? 0))}) issued`;
  return parts.join(', ');
}

/** Each change to the customer's money and when its mail went ("waiting to send" until the outbox has sent it). */
export function MoneyMails({ mails, events, currency }: { mails: MoneyMailView[]; events: MoneyMailEvent[]; currency: string }) {
  const { dateTime } = useFirmFormat();
  const shown = mails.filter((m) => events.includes(m.event));
  if (!shown.length) return null;
  const money = (minor: number) => formatMoney(minor, currency);
  return (
    <ul aria-label="What the customer was told" className="flex flex-col gap-1 rounded-md border border-paper-line bg-paper p-3 text-sm">
      {shown.map((m) => (
        <li key={m.id}>
          <span className="font-semibold">{whatHappened(m, money)}</span> on {dateTime(m.at)};{' '}
          {m.mail === 'sent' && m.sentAt
            ? `mailed to ${m.sentTo.join(', ')} at ${dateTime(m.sentAt)}.`
            : m.mail === 'failed'
              ? `the mail to ${m.sentTo.join(', ')} could not be sent.`
              : `mail to ${m.sentTo.join(', ')} waiting to send.`}
        </li>
      ))}
    </ul>
  );
}
