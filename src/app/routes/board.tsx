import { formatDateRange } from '../../lib/format';
import { format, parseISO, startOfWeek } from 'date-fns';
import { useCallback, useId, useMemo } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { AssetTypeSelect } from '../../components/asset-type-select';
import { Button, buttonClasses } from '../../components/button';
import { DateInput } from '../../components/date-field';
import { ClockIcon, PlusIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useBookings } from '../../features/bookings/api/get-bookings';
import { BookingBoard, type BoardTarget } from '../../features/bookings/components/booking-board';
import { bookFormHref } from '../../features/bookings/components/book-href';
import { BookingsList } from '../../features/bookings/components/bookings-list';
import { CalendarFeed } from '../../features/bookings/components/calendar-feed';
import { useAssets } from '../../features/fleet/api/get-assets';
import { assetTypes, type AssetStatus, type AssetType } from '../../lib/assets';
import { addDays, todayIn, type BookingState } from '../../lib/bookings';
import { can } from '../../lib/roles';

const weekChoices = [2, 4, 8, 12] as const;
const boardStates: BookingState[] = ['reserved', 'out', 'returned', 'not_collected'];
const liveStatuses: AssetStatus[] = ['ready', 'out', 'at_lab', 'held'];

const mondayOf = (date: string) => format(startOfWeek(parseISO(date), { weekStartsOn: 1 }), 'yyyy-MM-dd');
const isDate = (s: string | null): s is string => !!s && /^\d{4}-\d{2}-\d{2}$/.test(s) && !Number.isNaN(parseISO(s).getTime());

export default function BoardRoute() {
  const { user, organization } = useSession();
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const today = todayIn(organization.timeZone);
  const from = mondayOf(isDate(params.get('from')) ? params.get('from')! : today);
  const weeksParam = Number(params.get('weeks'));
  const weeks = (weekChoices as readonly number[]).includes(weeksParam) ? weeksParam : 4;
  const days = weeks * 7;
  const to = addDays(from, days - 1);
  const typeParam = params.get('type');
  const type = typeParam && (assetTypes as readonly string[]).includes(typeParam) ? (typeParam as AssetType) : '';
  const listView = params.get('view') === 'list';
  const canBook = can(user.role, 'bookings.write');
  const weeksId = useId();
  const jumpId = useId();

  const assets = useAssets({ status: liveStatuses, type: type ? [type] : undefined, sort: 'assetTag', limit: 500, offset: 0 });
  const windowBookings = useBookings({ from, to, state: boardStates });
  // Kit still out after its last day is drawn on to today, marked late, even when that day is before the window.
  const outNow = useBookings({ state: ['out'] });
  const bookingItems = useMemo(() => {
    const items = windowBookings.data?.items;
    if (!items) return undefined;
    const seen = new Set(items.map((b) => b.id));
    const late = (outNow.data?.items ?? []).filter((b) => !seen.has(b.id) && b.endsOn < today && today >= from);
    return late.length ? [...items, ...late] : items;
  }, [windowBookings.data, outNow.data, today, from]);

  const setParam = useCallback(
    (changes: Record<string, string | null>) =>
      setParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v) next.set(k, v);
            else next.delete(k);
          }
          return next;
        },
        { replace: true },
      ),
    [setParams],
  );

  const onPick = useCallback((target: BoardTarget, startsOn: string, endsOn: string) => navigate(bookFormHref(target, startsOn, endsOn)), [navigate]);

  // With a type chosen, only bookings that carry an item of that type are listed.
  const shownBookings = useMemo(() => {
    const items = bookingItems;
    if (!items || !type) return items;
    return items.filter((b) => b.items.some((i) => i.type === type));
  }, [bookingItems, type]);

  return (
    <>
      <PageHeader
        title="Bookings"
        description="Who has which kit on which days. Drag across empty days on a row, or click its first and last day, to book it."
        actions={
          canBook ? (
            <Link to="/bookings/new" className={buttonClasses('primary')}>
              <PlusIcon size={16} />
              Book kit
            </Link>
          ) : null
        }
      />

      <div className="mb-3 flex flex-wrap items-end gap-3">
        <div className="flex items-end gap-1" role="group" aria-label="Change week">
          <Button onClick={() => setParam({ from: addDays(from, -7) })}>Previous week</Button>
          <Button onClick={() => setParam({ from: null })} disabled={from === mondayOf(today)}>
            This week
          </Button>
          <Button onClick={() => setParam({ from: addDays(from, 7) })}>Next week</Button>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={jumpId} className="text-sm font-semibold text-ink-800">
            Jump to week
          </label>
          <DateInput id={jumpId} value={from} onValueChange={(value) => (isDate(value) ? setParam({ from: mondayOf(value) }) : undefined)} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={weeksId} className="text-sm font-semibold text-ink-800">
            Weeks shown
          </label>
          <select
            id={weeksId}
            value={weeks}
            onChange={(e) => setParam({ weeks: e.target.value === '4' ? null : e.target.value })}
            className="min-h-10 rounded-md border border-paper-line bg-card px-2"
          >
            {weekChoices.map((w) => (
              <option key={w} value={w}>
                {w} weeks
              </option>
            ))}
          </select>
        </div>
        <AssetTypeSelect label="Show type" anyLabel="All types" value={type} onChange={(t) => setParam({ type: t || null })} />
        <Button
          className="ml-auto"
          aria-pressed={listView}
          variant={listView ? 'primary' : 'secondary'}
          onClick={() => setParam({ view: listView ? null : 'list' })}
        >
          List view
        </Button>
      </div>

      <p className="mb-2 text-sm font-semibold text-ink-800" aria-live="polite">
        {formatDateRange(from, to)}
        {windowBookings.data ? ` · ${shownBookings?.length ?? 0} ${shownBookings?.length === 1 ? 'booking' : 'bookings'}` : ''}
      </p>

      {assets.isError ? (
        <Notice tone="error" className="mb-3">
          {assets.error.message}
        </Notice>
      ) : null}
      {windowBookings.isError ? (
        <Notice tone="error" className="mb-3">
          {windowBookings.error.message}
        </Notice>
      ) : null}
      {assets.data && assets.data.total > assets.data.items.length ? (
        <Notice tone="info" className="mb-3">
          The board shows the first {assets.data.items.length} of {assets.data.total} items. Choose a type to see the rest.
        </Notice>
      ) : null}

      {listView ? (
        <BookingsList bookings={shownBookings} loading={windowBookings.isPending} onOpen={(b) => navigate(`/bookings/${b.id}`)} />
      ) : assets.isPending || windowBookings.isPending ? (
        <LoadingPanel label="Drawing the board…" />
      ) : (
        <>
          <BoardLegend />
          <BookingBoard
            assets={assets.data?.items ?? []}
            bookings={shownBookings ?? []}
            from={from}
            days={days}
            today={today}
            canBook={canBook}
            onPick={onPick}
            bookHref={bookFormHref}
          />
        </>
      )}

      <div className="mt-4">
        <CalendarFeed />
      </div>
    </>
  );
}

/** The board's marks, each a pattern plus a word. */
function BoardLegend() {
  const swatch = 'inline-block h-4 w-8 rounded-sm align-middle';
  return (
    <ul aria-label="How to read the board" className="mb-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-800">
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-reserved`} /> Reserved (outlined)
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-out`} /> Out (solid)
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-returned`} /> Returned (hatched)
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-remainder`} /> Planned days after an early return (faint)
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-not_collected`} /> Not collected (dotted)
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-bar-reserved nk-bar-due`} /> Falls due during the booking
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className="flex h-4 w-4 items-center justify-center rounded-full border border-warn bg-warn-wash text-warn">
          <ClockIcon size={11} />
        </span>
        Calibration due date
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className={`${swatch} nk-board-held border border-paper-line`} /> On hold
      </li>
    </ul>
  );
}
