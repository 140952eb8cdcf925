import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/button';
import { EmptyState } from '../../../components/empty-state';
import { StatusChip } from '../../../components/status-chip';
import { csrfToken } from '../../../lib/api-client';
import type { OutboxRecord, OutboxState } from '../../../lib/field/field-store';
import { discardFieldRecord, flushOutbox } from '../../../lib/field/outbox';
import { useOnline, useOutbox } from '../../../lib/field/use-field-state';
import { formatDateTime } from '../../../lib/format';

const stateChip: Record<OutboxState, { tone: 'ok' | 'paused' | 'bad'; label: string }> = {
  sent: { tone: 'ok', label: 'Sent' },
  waiting: { tone: 'paused', label: 'Waiting' },
  refused: { tone: 'bad', label: 'Refused' },
};

/** Where a record opens again for correcting: the same form, filled as it was written. */
const correctHref = (r: OutboxRecord) => `${r.request.kind === 'check' ? '/checks/new' : '/incidents/new'}?assetId=${r.assetId}&correct=${r.id}`;

/** The server's own answer once a record arrived: the decision for a check, the report's page for damage. */
function ServerAnswer({ record }: { record: OutboxRecord }) {
  if (record.request.kind === 'check') {
    const decision = (record.reply as { result?: { decision?: string } } | null)?.result?.decision;
    return (
      <p className="text-sm">
        The server decided: <strong>{decision === 'pass' ? 'passed' : decision === 'fail' ? 'failed — the item is on hold' : '—'}</strong>.{' '}
        <Link to={`/checks/${record.id}`} className="font-semibold text-brass-deep underline">
          See the check
        </Link>
      </p>
    );
  }
  return (
    <p className="text-sm">
      The item is on hold; the shop manager and the owner have been e-mailed.{' '}
      <Link to={`/incidents/${record.id}`} className="font-semibold text-brass-deep underline">
        See the report
      </Link>
    </p>
  );
}

function Discard({ record }: { record: OutboxRecord }) {
  const [asking, setAsking] = useState(false);
  if (!asking)
    return (
      <Button size="sm" onClick={() => setAsking(true)}>
        Discard
      </Button>
    );
  return (
    <span className="flex flex-wrap items-center gap-2">
      <span className="text-sm font-semibold">It will never reach the server.</span>
      <Button size="sm" variant="danger" onClick={() => void discardFieldRecord(record.id)}>
        Discard for good
      </Button>
      <Button size="sm" onClick={() => setAsking(false)}>
        Keep it
      </Button>
    </span>
  );
}

function OutboxLine({ record }: { record: OutboxRecord }) {
  const chip = stateChip[record.state];
  const photos = record.request.kind === 'incident' ? record.request.photos.length : 0;
  return (
    <li className="flex flex-col gap-2 border-b border-paper-line py-3 last:border-0">
      <div className="flex flex-wrap items-center gap-2">
        <StatusChip tone={chip.tone} label={chip.label} />
        <span className="font-semibold">{record.title}</span>
      </div>
      <p className="text-sm text-ink-700">
        Written on this phone {formatDateTime(record.queuedAt)}
        {photos ? ` · ${photos} photo${photos === 1 ? '' : 's'} kept here` : ''}
        {record.sentAt
          ? ` · arrived ${formatDateTime(record.sentAt)}`
          : record.attempts
            ? ` · tried ${record.attempts} time${record.attempts === 1 ? '' : 's'}`
            : ''}
      </p>
      {record.state === 'sent' ? <ServerAnswer record={record} /> : null}
      {record.state === 'refused' && record.refusal ? (
        <div className="rounded-md border border-bad bg-bad-wash px-3 py-2 text-sm text-ink-950">
          <p className="font-semibold">The server refused it: {record.refusal.message}</p>
          {Object.entries(record.refusal.fields).map(([field, message]) => (
            <p key={field}>
              {field}: {message}
            </p>
          ))}
        </div>
      ) : null}
      {record.state !== 'sent' ? (
        <div className="flex flex-wrap gap-2">
          {record.state === 'refused' ? (
            <Link to={correctHref(record)} className={buttonClasses('primary', 'sm')}>
              Correct it
            </Link>
          ) : null}
          <Discard record={record} />
        </div>
      ) : null}
    </li>
  );
}

/** Every field record on this phone: sent, waiting for signal, or refused with the server's reason. */
export function OutboxList({ userId }: { userId: string }) {
  const records = useOutbox();
  const online = useOnline();
  const [sending, setSending] = useState(false);
  if (records === null) return null;
  if (!records.length)
    return <EmptyState title="Nothing on this phone">Checks and damage reports written here wait in this list until they reach the server.</EmptyState>;
  const waiting = records.filter((r) => r.state === 'waiting').length;
  const refused = records.filter((r) => r.state === 'refused').length;
  const heading = [waiting ? `${waiting} waiting to be sent` : '', refused ? `${refused} refused: correct or discard` : ''].filter(Boolean).join(' · ');
  return (
    <section aria-labelledby="outbox-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-1 flex flex-wrap items-center justify-between gap-2">
        <h2 id="outbox-heading" className="text-lg font-bold">
          {heading || 'Everything here has reached the server'}
        </h2>
        {waiting && online ? (
          <Button
            size="sm"
            busy={sending}
            onClick={() => {
              setSending(true);
              void flushOutbox(userId, csrfToken).finally(() => setSending(false));
            }}
          >
            Send now
          </Button>
        ) : null}
      </div>
      <ul>
        {[...records].reverse().map((r) => (
          <OutboxLine key={r.id} record={r} />
        ))}
      </ul>
    </section>
  );
}
