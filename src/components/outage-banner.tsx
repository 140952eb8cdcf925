import { useSyncExternalStore } from 'react';
import { isDatabaseAway, subscribeDatabaseOutage } from '../lib/database-outage';
import { SpinnerIcon } from './icons';

/** The one calm line shown while the server cannot reach its database; pages keep what they showed and fill in again by themselves. */
export function OutageBanner() {
  const away = useSyncExternalStore(subscribeDatabaseOutage, isDatabaseAway, () => false);
  if (!away) return null;
  return (
    // Above the phone's menu bar, in the corner on wider screens: always in view, never over the page's header.
    <div
      role="status"
      className="fixed inset-x-3 bottom-17 z-50 rounded-md border border-info/40 bg-info-wash px-3 py-2 text-ink-900 shadow-lg sm:inset-x-auto sm:right-4 sm:bottom-4 sm:max-w-md print:hidden"
    >
      <p className="flex items-start gap-2 text-sm">
        <SpinnerIcon size={16} className="mt-0.5 shrink-0 text-info" />
        <span>
          <span className="font-semibold">Nestkeeper cannot reach its database; retrying…</span>{' '}
          <span className="text-ink-700">Nothing you saved is lost. Pages fill in again once it answers; changes you make meanwhile are not saved.</span>
        </span>
      </p>
    </div>
  );
}
