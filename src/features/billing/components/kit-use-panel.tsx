import { Link } from 'react-router-dom';
import { addDays } from '../../../lib/bookings';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatMoney } from '../../../lib/format';
import { useRevenue } from '../api/get-revenue';
import { useUtilisation } from '../api/get-utilisation';

/**
 * The owner's home panel: each kit's share of the last 90 days booked out,
 * and what its rentals were invoiced from that month on (net of credit notes,
 * so a credit against an older invoice can make it negative).
 */
export function KitUsePanel({ today, currency }: { today: string; currency: string }) {
  const from = addDays(today, -89);
  const use = useUtilisation({ from, to: today });
  const revenue = useRevenue({ from: from.slice(0, 7), to: today.slice(0, 7) });
  const rows = use.data?.items ?? [];
  const invoiced = (kitId: string) => (revenue.data?.items ?? []).filter((r) => r.kitId === kitId).reduce((s, r) => s + r.revenueMinor, 0);
  const failed = use.error ?? revenue.error;
  const since = new Intl.DateTimeFormat(undefined, { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${from}T00:00:00Z`));
  return (
    <CountedSection
      id="kit-use-heading"
      title="Use and revenue per kit"
      count={use.data ? rows.length : undefined}
      empty="No kits yet."
      status={use.isPending ? <LoadingPanel label="Adding up the last 90 days…" /> : failed ? <Notice tone="error">{failed.message}</Notice> : null}
    >
      {rows.map((k) => (
        <li key={k.kitId} className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5">
          <span className="font-semibold text-ink-900">{k.kitName}</span>
          <span className="text-sm text-ink-700">{Math.round(k.ratio * 100)} % of the last 90 days booked</span>
          <span className="ml-auto shrink-0 text-sm">
            {formatMoney(invoiced(k.kitId), currency)} invoiced since {since}, net of credit notes
          </span>
        </li>
      ))}
      <li className="px-1 pt-2">
        <Link to="/billing/reports" className="text-sm font-semibold text-brass-deep underline">
          Revenue and use by month
        </Link>
      </li>
    </CountedSection>
  );
}
