import { useId, useState } from 'react';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { useCreateCalendarToken } from '../api/create-calendar-token';

/** "Add to your calendar": a secret iCalendar feed address of my bookings and due dates, with a copy button. */
export function CalendarFeed() {
  const token = useCreateCalendarToken();
  const [copied, setCopied] = useState(false);
  const inputId = useId();
  const url = token.data ? new URL(token.data.url, window.location.origin).toString() : null;

  async function copy() {
    if (!url) return;
    try {
      await navigator.clipboard.writeText(url);
      setCopied(true);
    } catch {
      (document.getElementById(inputId) as HTMLInputElement | null)?.select();
    }
  }

  return (
    <details className="rounded-lg border border-paper-line bg-card px-4 py-2">
      <summary className="cursor-pointer font-semibold text-ink-900">Add to your calendar</summary>
      <div className="mt-2 flex flex-col gap-2 text-sm text-ink-700">
        <p>
          Your calendar program can follow your bookings and the fleet&rsquo;s due dates from a private address. Anyone who has the address can read the feed,
          so keep it to yourself. Making a new address stops the old one.
        </p>
        {token.isError ? <Notice tone="error">{token.error.message}</Notice> : null}
        {url ? (
          <div className="flex flex-wrap items-end gap-2">
            <div className="flex min-w-64 flex-1 flex-col gap-1">
              <label htmlFor={inputId} className="font-semibold text-ink-800">
                Calendar address
              </label>
              <input
                id={inputId}
                readOnly
                value={url}
                onFocus={(e) => e.currentTarget.select()}
                className="min-h-9 rounded-md border border-paper-line bg-paper px-2 font-mono text-xs"
              />
            </div>
            <Button size="sm" onClick={copy}>
              {copied ? 'Copied' : 'Copy address'}
            </Button>
          </div>
        ) : null}
        <div>
          <Button
            size="sm"
            busy={token.isPending}
            onClick={() => {
              setCopied(false);
              token.mutate();
            }}
          >
            {url ? 'Make a new address' : 'Show my calendar address'}
          </Button>
        </div>
      </div>
    </details>
  );
}
