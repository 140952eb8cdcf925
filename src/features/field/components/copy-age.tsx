import { formatDistanceToNowStrict } from 'date-fns';
import { useEffect, useState } from 'react';
import { StatusChip } from '../../../components/status-chip';
import { formatDateTime } from '../../../lib/format';
import { useOnline } from '../../../lib/field/use-field-state';
import { useStoredCopy } from '../api/get-field-copy';

/** Redraws every half minute so "how old" stays true on a screen left open. */
function useNow(everyMs = 30_000) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(timer);
  }, [everyMs]);
  return now;
}

/** "No signal · kit list from 14:02 (12 minutes ago)": what the phone shows is only as new as its copy. */
export function CopyAge() {
  const online = useOnline();
  const stored = useStoredCopy();
  const now = useNow();
  const madeAt = stored.data?.copy.madeAt;
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm text-ink-700" aria-live="polite">
      {online ? <StatusChip tone="ok" label="Signal" /> : <StatusChip tone="paused" label="No signal" />}
      {madeAt ? (
        <span>
          Kit on this phone as of <time dateTime={madeAt}>{formatDateTime(madeAt)}</time> (
          {formatDistanceToNowStrict(new Date(Math.min(Date.parse(madeAt), now)), { addSuffix: true })}){online ? '' : '; it refreshes when there is signal'}.
        </span>
      ) : stored.isPending ? null : (
        <span>{online ? 'Copying your kit to this phone…' : 'No copy of your kit on this phone yet: open Nestkeeper once with signal.'}</span>
      )}
    </p>
  );
}
