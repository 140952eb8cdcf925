import { useState } from 'react';
import { Button } from '../../../components/button';
import { EmptyState } from '../../../components/empty-state';
import { MailIcon, RefreshIcon } from '../../../components/icons';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatCount, useFirmFormat } from '../../../lib/format';
import { useMessages } from '../api/get-messages';
import { MessageReader } from './message-reader';

const pageSize = 50;

/** The owner's view of every e-mail Nestkeeper has sent, newest first, with a reader pane. */
export function Mailbox() {
  const [offset, setOffset] = useState(0);
  const [selectedId, setSelectedId] = useState<string>();
  const messages = useMessages({ limit: pageSize, offset });
  const fmt = useFirmFormat();

  if (messages.isPending) return <LoadingPanel label="Loading messages…" />;
  if (messages.isError) {
    return (
      <Notice tone="error" title="The mailbox could not be loaded">
        {messages.error.message}
      </Notice>
    );
  }

  const { items, total } = messages.data;
  const selected = items.find((m) => m.id === selectedId);
  const first = total === 0 ? 0 : offset + 1;
  const last = Math.min(offset + items.length, total);

  if (total === 0) {
    return (
      <EmptyState icon={<MailIcon size={20} />} title="No messages yet">
        E-mails Nestkeeper sends — due-date reminders, incident alerts, invoices — will be listed here as they go out.
      </EmptyState>
    );
  }

  return (
    <div className="grid gap-4 sm:grid-cols-[minmax(16rem,22rem)_1fr]">
      <section aria-label="Messages" className={`flex min-w-0 flex-col gap-2 ${selected ? 'hidden sm:flex' : ''}`}>
        <div className="flex items-center justify-between gap-2 text-sm text-ink-700">
          <span>
            {formatCount(first)}–{formatCount(last)} of {formatCount(total)}
          </span>
          <Button size="sm" variant="quiet" icon={<RefreshIcon size={14} />} busy={messages.isFetching} onClick={() => messages.refetch()}>
            Refresh
          </Button>
        </div>
        <ul className="flex flex-col divide-y divide-paper-line overflow-hidden rounded-md border border-paper-line bg-card">
          {items.map((m) => {
            const isSelected = m.id === selected?.id;
            return (
              <li key={m.id}>
                <button
                  type="button"
                  aria-current={isSelected ? 'true' : undefined}
                  onClick={() => setSelectedId(m.id)}
                  className={`flex w-full flex-col items-start gap-0.5 border-l-4 px-3 py-2 text-left hover:bg-paper-deep ${
                    isSelected ? 'border-brass bg-brass-wash' : 'border-transparent'
                  }`}
                >
                  <span className="w-full truncate font-semibold">{m.subject || '(no subject)'}</span>
                  <span className="w-full truncate font-mono text-xs text-ink-700">To {m.to.join(', ')}</span>
                  <time dateTime={m.receivedAt} className="text-xs text-ink-500">
                    {fmt.dateTime(m.receivedAt)}
                  </time>
                </button>
              </li>
            );
          })}
        </ul>
        {total > pageSize ? (
          <div className="flex justify-between gap-2">
            <Button size="sm" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - pageSize))}>
              Newer
            </Button>
            <Button size="sm" disabled={offset + pageSize >= total} onClick={() => setOffset(offset + pageSize)}>
              Older
            </Button>
          </div>
        ) : null}
      </section>
      <section aria-label="Reader" className={`min-w-0 ${selected ? '' : 'hidden sm:block'}`}>
        {selected ? (
          <MessageReader key={selected.id} message={selected} onBack={() => setSelectedId(undefined)} />
        ) : (
          <EmptyState title="Pick a message" headingLevel={2}>
            Choose a message on the left to read it here.
          </EmptyState>
        )}
      </section>
    </div>
  );
}
