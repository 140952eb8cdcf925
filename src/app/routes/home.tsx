import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState } from '../../components/empty-state';
import { ScanIcon } from '../../components/icons';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { MyKitPanels, TodayAtCounter } from '../../features/bookings/components/desk-panels';
import { OpenImpactReviews } from '../../features/calibration/components/impact-review-links';
import { RecalibrationsDue } from '../../features/fleet/components/due-list';
import { ChecksToDo } from '../../features/checks/components/checks-to-do';
import { TipsForecastToFail } from '../../features/checks/components/drift-forecast';
import { HeldItems } from '../../features/fleet/components/held-list';
import { KitUsePanel } from '../../features/billing/components/kit-use-panel';
import { UnpaidInvoices } from '../../features/billing/components/unpaid-invoices';
import { RentalDeskPanels } from '../../features/rentals/components/rental-desk-panels';
import { todayIn } from '../../lib/bookings';
import { IncidentList } from '../../features/incidents/components/incident-list';
import type { Role } from '../../lib/roles';
import { FieldHomePanels, PhonePanel } from '../../features/field/components/phone-panel';
import { useOnline } from '../../lib/field/use-field-state';

interface Panel {
  title: string;
  body: ReactNode;
  /** A live panel drawn by a feature instead of the "will appear here" text. */
  live?: () => ReactNode;
}

interface RoleHome {
  title: string;
  description: string;
  panels: Panel[];
  /** Pages that already exist and help this role get started. */
  links?: { to: string; label: string; note: string }[];
}

/** The owner's kit panel, in the firm's own calendar and currency. */
function OwnerKitUse() {
  const { organization } = useSession();
  return <KitUsePanel today={todayIn(organization.timeZone)} currency={organization.currency} />;
}

/** The billing clerk's desk: holds near lapse, deposits to settle, rentals to invoice (rentals), then invoices to chase (billing). */
function BillingDesk() {
  return (
    <>
      <RentalDeskPanels />
      <UnpaidInvoices />
    </>
  );
}

/** Each role's home: live panels drawn by the features, and plain words where a panel only points the way. */
const homes: Record<Role, RoleHome> = {
  owner: {
    title: "Owner's overview",
    description: 'What needs your decision across the fleet, the calendar and the books.',
    panels: [
      {
        title: 'Recalibrations due',
        body: null,
        live: () => (
          <RecalibrationsDue
            footer={
              <Link to="/calibration" className="text-sm font-semibold text-brass-deep underline">
                Open the calibration review to plan lab trips
              </Link>
            }
          />
        ),
      },
      { title: 'Today at the counter', body: null, live: () => <TodayAtCounter /> },
      { title: 'On hold', body: null, live: () => <HeldItems /> },
      { title: 'Open incidents', body: null, live: () => <OpenIncidents /> },
      {
        title: 'Looking ahead',
        body: null,
        // One panel: open impact reviews with their re-measures, then tips whose trend reaches the limit soon (advice only).
        live: () => (
          <OpenImpactReviews title="Looking ahead: impact reviews and tip trends">
            <div className="mt-3 [&>section]:border-0 [&>section]:p-0">
              <TipsForecastToFail level={3} />
            </div>
          </OpenImpactReviews>
        ),
      },
      { title: 'Use and revenue per kit', body: null, live: () => <OwnerKitUse /> },
    ],
    links: [
      { to: '/users', label: 'Users', note: 'Add the people in your firm and give each a role.' },
      { to: '/mailbox', label: 'Mailbox', note: 'Read every e-mail Nestkeeper has sent.' },
      { to: '/admin/routines', label: 'Routines', note: 'See when the daily scans and other routines last ran, or run one now.' },
    ],
  },
  manager: {
    title: 'Shop floor today',
    description: 'What goes out, what comes back and what is waiting on you today.',
    panels: [
      { title: 'Recalibrations due', body: null, live: () => <RecalibrationsDue /> },
      { title: 'Today at the counter', body: null, live: () => <TodayAtCounter /> },
      { title: 'On hold', body: null, live: () => <HeldItems /> },
      { title: 'Open incidents', body: null, live: () => <OpenIncidents /> },
    ],
  },
  technician: {
    title: 'My kit',
    description: 'The kit in your care and the checks it needs.',
    panels: [
      { title: 'Kit I carry now', body: null, live: () => <MyKitPanels /> },
      { title: 'Checks to do', body: null, live: () => <ChecksToDo /> },
      { title: 'Recent incidents', body: null, live: () => <RecentIncidents /> },
      {
        title: 'Report damage',
        body: 'Find the item by its label, then choose “Report damage” on its page — from this phone, with photos. Do not use a damaged item. A dropped, swollen or damaged battery is a fire risk: do not charge it or pack it for a flight.',
      },
    ],
  },
  billing: {
    title: 'Billing desk',
    description: 'Rentals to price, deposits to handle and invoices to issue.',
    panels: [{ title: 'Billing desk', body: null, live: () => <BillingDesk /> }],
  },
};

function OpenIncidents() {
  return (
    <section aria-labelledby="open-incidents-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <h2 id="open-incidents-heading" className="mb-2 text-base font-semibold text-ink-900">
        Open incidents
      </h2>
      <IncidentList
        params={{ state: ['reported', 'reviewing'], limit: 8, offset: 0 }}
        empty="No damage or loss reports are waiting."
        moreLink={{ to: '/incidents', label: (total) => `See all ${total} open incidents` }}
      />
    </section>
  );
}

/** The latest reports in the firm, so a technician can follow what happened to the kit. */
function RecentIncidents() {
  return (
    <section aria-labelledby="recent-incidents-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <h2 id="recent-incidents-heading" className="mb-2 text-base font-semibold text-ink-900">
        Recent incidents
      </h2>
      <IncidentList
        params={{ limit: 5, offset: 0 }}
        empty="No damage or loss has been reported."
        moreLink={{ to: '/incidents?state=all', label: () => 'See all incidents' }}
      />
    </section>
  );
}

export default function HomeRoute() {
  const { user } = useSession();
  const online = useOnline();
  const home = homes[user.role];
  const technician = user.role === 'technician';
  return (
    <>
      <PageHeader title={home.title} description={home.description} />
      {technician ? <PhonePanel /> : null}
      {technician ? (
        <Link
          to="/scan"
          className="mb-4 flex min-h-16 items-center gap-3 rounded-lg border-2 border-brass-deep bg-brass-wash px-4 py-3 text-lg font-bold text-ink-900 hover:bg-brass/30"
        >
          <ScanIcon size={28} className="shrink-0 text-brass-deep" />
          Find an item by its label
        </Link>
      ) : null}
      <div className="grid items-start gap-3 md:grid-cols-2 xl:grid-cols-3">
        {technician && !online ? <FieldHomePanels /> : null}
        {(technician && !online ? [] : home.panels).map((panel) =>
          panel.live ? (
            <div key={panel.title} className="contents">
              {panel.live()}
            </div>
          ) : (
            <EmptyState key={panel.title} title={panel.title}>
              {panel.body}
            </EmptyState>
          ),
        )}
      </div>
      {home.links ? (
        <section aria-labelledby="ready-now" className="mt-8">
          <h2 id="ready-now" className="mb-2 text-lg font-bold">
            Ready now
          </h2>
          <ul className="grid gap-2 md:grid-cols-3">
            {home.links.map((link) => (
              <li key={link.to}>
                <Link to={link.to} className="block rounded-lg border border-paper-line bg-card px-4 py-3 hover:border-brass-deep hover:bg-brass-wash">
                  <span className="block font-semibold text-ink-900">{link.label}</span>
                  <span className="block text-sm text-ink-700">{link.note}</span>
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}
