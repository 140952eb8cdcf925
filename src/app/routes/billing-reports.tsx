import { useSearchParams } from 'react-router-dom';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { useRevenue } from '../../features/billing/api/get-revenue';
import { useUtilisation } from '../../features/billing/api/get-utilisation';
import { monthLong, monthRangeDates, shiftMonth } from '../../features/billing/components/months';
import { RevenueChart } from '../../features/billing/components/revenue-chart';
import { UtilisationBars } from '../../features/billing/components/utilisation-bars';
import { todayIn } from '../../lib/bookings';

const isMonth = (s: string | null) => (s && /^\d{4}-\d{2}$/.test(s) ? s : undefined);

/** Revenue per kit per month and how much of the time each kit was booked; the last 12 months unless chosen. */
export default function BillingReportsRoute() {
  const { organization } = useSession();
  const [params, setParams] = useSearchParams();
  const thisMonth = todayIn(organization.timeZone).slice(0, 7);
  const to = isMonth(params.get('to')) ?? thisMonth;
  const from = isMonth(params.get('from')) ?? shiftMonth(to, -11);
  const valid = from <= to;
  const revenue = useRevenue({ from, to });
  const utilisation = useUtilisation(monthRangeDates(from, to));

  const pick = (key: 'from' | 'to', value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  return (
    <>
      <PageHeader
        title="Revenue and use"
        description="Invoiced rental revenue per kit per month, and how many of the days each kit could have been out it was booked."
      />
      <div className="mb-4 flex flex-wrap items-end gap-3">
        {(['from', 'to'] as const).map((key) => (
          <div key={key} className="flex flex-col gap-1">
            <label htmlFor={`report-${key}`} className="text-sm font-semibold text-ink-800">
              {key === 'from' ? 'From month' : 'To month'}
            </label>
            <input
              id={`report-${key}`}
              type="month"
              value={key === 'from' ? from : to}
              max={thisMonth}
              onChange={(e) => pick(key, e.target.value)}
              className="min-h-10 rounded-md border border-paper-line bg-card px-3"
            />
          </div>
        ))}
      </div>
      {!valid ? (
        <Notice tone="error">The first month is after the last one: pick a range that runs forwards.</Notice>
      ) : (
        <div className="flex flex-col gap-5">
          <Panel title="Revenue per kit">
            {revenue.isError ? <Notice tone="error">{revenue.error.message}</Notice> : null}
            {revenue.isPending ? <LoadingPanel label="Adding up the invoices…" /> : null}
            {revenue.data ? (
              revenue.data.items.length ? (
                <RevenueChart rows={revenue.data.items} from={from} to={to} currency={organization.currency} />
              ) : (
                <p className="text-ink-700">
                  No invoices were issued from {monthLong(from)} to {monthLong(to)}.
                </p>
              )
            ) : null}
          </Panel>
          <Panel title="Use per kit">
            {utilisation.isError ? <Notice tone="error">{utilisation.error.message}</Notice> : null}
            {utilisation.isPending ? <LoadingPanel label="Counting booked days…" /> : null}
            {utilisation.data ? (
              utilisation.data.items.length ? (
                <UtilisationBars rows={utilisation.data.items} />
              ) : (
                <p className="text-ink-700">The firm has no kits yet.</p>
              )
            ) : null}
          </Panel>
        </div>
      )}
    </>
  );
}
