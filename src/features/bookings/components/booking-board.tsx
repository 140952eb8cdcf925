import { differenceInCalendarDays, format, parseISO } from 'date-fns';
import { memo, useCallback, useContext, useEffect, useMemo, useState, type CSSProperties, type PointerEvent as ReactPointerEvent } from 'react';
import { Link } from 'react-router-dom';
import { AlertIcon, ClockIcon, PlusIcon } from '../../../components/icons';
import { StatusChip } from '../../../components/status-chip';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypeTitles } from '../../../lib/assets';
import { addDays, calendarDayIn } from '../../../lib/bookings';
import { useFirmFormat, formatCalendarDate, formatDateRange } from '../../../lib/format';
import type { BookingView } from '../../../../shared/bookings/views';
import './booking-board.css';
import { bookingStateWords, bookingTitle } from './booking-words';

/** What a stretch picked on the board books: a whole kit or one asset. */
export type BoardTarget = { kitId: string; assetId?: undefined } | { assetId: string; kitId?: undefined };

type KitRow = { kind: 'kit'; key: string; kitId: string; name: string; members: AssetView[] };
type AssetRow = { kind: 'asset'; key: string; asset: AssetView; inKit: boolean };
type Row = KitRow | AssetRow;

const HEAD_PX = 240;
const noBookings: BookingView[] = [];
const LANE_PX = 34;
const ROW_PAD_PX = 5;

/** Calibration runs out during the booking: the item is valid through its due date, so due on the last day is fine. */
function fallsDue(asset: AssetView, booking: BookingView): boolean {
  return asset.calibration.required && !!asset.calibration.dueOn && asset.calibration.dueOn < booking.endsOn;
}

interface BarModel {
  booking: BookingView;
  lane: number;
  first: number;
  last: number;
  dueTags: { tag: string; dueOn: string }[];
  late: boolean;
  /** The bar goes on past the window's last day. */
  endsAfter: boolean;
  /** Returned before its last day: the day it came back, and the planned days after it (drawn faint, holding nothing). */
  returnedEarlyOn: string | null;
  remainder: { first: number; last: number } | null;
}

/** The calendar day a returned booking came back, when that is before its last planned day. */
function earlyReturnDay(booking: BookingView, timeZone: string): string | null {
  if (booking.state !== 'returned' || !booking.returnedAt) return null;
  const day = calendarDayIn(new Date(booking.returnedAt), timeZone);
  return day < booking.endsOn ? (day < booking.startsOn ? booking.startsOn : day) : null;
}

/** Places bars in lanes so bars that share days never cover each other. */
function layoutBars(
  bookings: BookingView[],
  from: string,
  days: number,
  today: string,
  rowAssets: AssetView[],
  timeZone: string,
): { bars: BarModel[]; lanes: number } {
  const base = parseISO(from);
  const sorted = [...bookings].sort((a, b) => (a.startsOn < b.startsOn ? -1 : a.startsOn > b.startsOn ? 1 : 0));
  const laneEnds: number[] = [];
  const bars: BarModel[] = [];
  for (const booking of sorted) {
    // Still out after its last day: the bar runs on to today, marked late.
    const late = booking.state === 'out' && booking.endsOn < today;
    const returnedEarlyOn = earlyReturnDay(booking, timeZone);
    const first = Math.max(0, differenceInCalendarDays(parseISO(booking.startsOn), base));
    const last = Math.min(days - 1, differenceInCalendarDays(parseISO(late ? today : (returnedEarlyOn ?? booking.endsOn)), base));
    const remainder = returnedEarlyOn
      ? {
          first: Math.max(0, differenceInCalendarDays(parseISO(addDays(returnedEarlyOn, 1)), base)),
          last: Math.min(days - 1, differenceInCalendarDays(parseISO(booking.endsOn), base)),
        }
      : null;
    if (last < 0 || first > days - 1) {
      // The days used lie outside the window; only the faint planned remainder might show. It holds nothing, so it takes no lane.
      if (remainder && remainder.last >= 0 && remainder.first <= days - 1 && remainder.first <= remainder.last)
        bars.push({
          booking,
          lane: 0,
          first: -1,
          last: -1,
          dueTags: [],
          late: false,
          endsAfter: booking.endsOn > addDays(from, days - 1),
          returnedEarlyOn,
          remainder,
        });
      continue;
    }
    let lane = laneEnds.findIndex((end) => end < first);
    if (lane < 0) lane = laneEnds.push(last) - 1;
    else laneEnds[lane] = last;
    const active = booking.state === 'reserved' || booking.state === 'out';
    const dueTags = active
      ? rowAssets.filter((a) => booking.assetIds.includes(a.id) && fallsDue(a, booking)).map((a) => ({ tag: a.assetTag, dueOn: a.calibration.dueOn ?? '' }))
      : [];
    const endsAfter = (late ? today : (returnedEarlyOn ?? booking.endsOn)) > addDays(from, days - 1);
    bars.push({
      booking,
      lane,
      first,
      last,
      dueTags,
      late,
      endsAfter,
      returnedEarlyOn,
      remainder: remainder && remainder.first <= remainder.last ? remainder : null,
    });
  }
  return { bars, lanes: Math.max(1, laneEnds.length) };
}

/** The bar's accessible name starts with exactly what the bar shows (its title, then "Late"), so a person can say what they see (WCAG 2.5.3). */
function barName(bar: BarModel): string {
  const { booking } = bar;
  const due = bar.dueTags.length ? `, falls due during this booking (${bar.dueTags.map((d) => `${d.tag} due ${formatCalendarDate(d.dueOn)}`).join(', ')})` : '';
  const late = bar.late ? `, was due back ${formatCalendarDate(booking.endsOn)}` : '';
  const early = bar.returnedEarlyOn ? `, back early on ${formatCalendarDate(bar.returnedEarlyOn)}` : '';
  const shown = `${bookingTitle(booking)}${bar.late ? ' Late' : ''}`;
  return `${shown}, ${formatDateRange(booking.startsOn, booking.endsOn)}, ${bookingStateWords[booking.state].toLowerCase()}${early}${late}${due}`;
}

interface Pick {
  rowKey: string;
  anchor: number;
  current: number;
  dragging: boolean;
}

export interface BookingBoardProps {
  /** Assets to show (retired left out by the caller); kit rows come from each asset's kit. */
  assets: AssetView[];
  /** Bookings touching the window (cancelled left out by the caller). */
  bookings: BookingView[];
  /** First day shown (a Monday). */
  from: string;
  days: number;
  today: string;
  /** Booking is allowed: empty stretches can be picked and rows get a "Book" link. */
  canBook: boolean;
  onPick: (target: BoardTarget, startsOn: string, endsOn: string) => void;
  /** Where the form opens for a row when booked from the keyboard. */
  bookHref: (target: BoardTarget, startsOn: string, endsOn: string) => string;
}

/**
 * Nestkeeper's booking board: kits (collapsible to their members) and loose
 * items down the side, days across. A row is one element whose background draws
 * the day columns; only bars, due-date markers and the picked stretch are elements.
 */
export function BookingBoard({ assets, bookings, from, days, today, canBook, onPick, bookHref }: BookingBoardProps) {
  const [collapsed, setCollapsed] = useState<ReadonlySet<string>>(() => new Set());
  const [pick, setPick] = useState<Pick | null>(null);
  // The focused bar's words (state included) under the board, for keyboard users who cannot hover.
  const [focused, setFocused] = useState<string | null>(null);
  const dayPx = days > 35 ? 30 : 36;

  const rows = useMemo<Row[]>(() => {
    const kits = new Map<string, KitRow>();
    const loose: AssetRow[] = [];
    for (const asset of assets) {
      if (asset.kit) {
        let kit = kits.get(asset.kit.id);
        if (!kit) {
          kit = { kind: 'kit', key: `kit:${asset.kit.id}`, kitId: asset.kit.id, name: asset.kit.name, members: [] };
          kits.set(asset.kit.id, kit);
        }
        kit.members.push(asset);
      } else loose.push({ kind: 'asset', key: `asset:${asset.id}`, asset, inKit: false });
    }
    const out: Row[] = [];
    for (const kit of [...kits.values()].sort((a, b) => a.name.localeCompare(b.name))) {
      kit.members.sort((a, b) => a.assetTag.localeCompare(b.assetTag));
      out.push(kit);
      if (!collapsed.has(kit.kitId)) {
        for (const asset of kit.members) out.push({ kind: 'asset', key: `asset:${asset.id}`, asset, inKit: true });
      }
    }
    loose.sort((a, b) => a.asset.assetTag.localeCompare(b.asset.assetTag));
    return out.concat(loose);
  }, [assets, collapsed]);

  const index = useMemo(() => {
    const byAsset = new Map<string, BookingView[]>();
    const byKit = new Map<string, BookingView[]>();
    for (const booking of bookings) {
      for (const id of booking.assetIds) {
        const list = byAsset.get(id);
        if (list) list.push(booking);
        else byAsset.set(id, [booking]);
      }
      if (booking.kitId) {
        const list = byKit.get(booking.kitId);
        if (list) list.push(booking);
        else byKit.set(booking.kitId, [booking]);
      }
    }
    return { byAsset, byKit };
  }, [bookings]);

  const rowBookings = useMemo(() => {
    const map = new Map<string, BookingView[]>();
    for (const row of rows) {
      map.set(row.key, row.kind === 'kit' ? kitRowBookings(row, index, collapsed.has(row.kitId)) : (index.byAsset.get(row.asset.id) ?? []));
    }
    return map;
  }, [rows, index, collapsed]);

  const toggleKit = useCallback((kitId: string) => {
    setCollapsed((prev) => {
      const next = new Set(prev);
      if (next.has(kitId)) next.delete(kitId);
      else next.add(kitId);
      return next;
    });
  }, []);

  useEffect(() => {
    if (!pick) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') setPick(null);
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [pick]);

  const finishPick = useCallback(
    (row: Row, a: number, b: number) => {
      setPick(null);
      const target: BoardTarget = row.kind === 'kit' ? { kitId: row.kitId } : { assetId: row.asset.id };
      onPick(target, addDays(from, Math.min(a, b)), addDays(from, Math.max(a, b)));
    },
    [from, onPick],
  );

  const todayIndex = differenceInCalendarDays(parseISO(today), parseISO(from));
  const weeks = Math.ceil(days / 7);
  const last = addDays(from, days - 1);
  const style = { '--day': `${dayPx}px`, '--head': `${HEAD_PX}px` } as CSSProperties;
  const spanPx = days * dayPx;

  return (
    <div
      className="nk-board relative max-h-[72dvh] overflow-auto rounded-lg border border-paper-line bg-card"
      style={style}
      onFocus={(e) => setFocused(e.target instanceof HTMLElement && e.target.hasAttribute('data-bar') ? e.target.getAttribute('aria-label') : null)}
      onBlur={() => setFocused(null)}
    >
      <div
        role="table"
        aria-label={`Booking board, ${formatDateRange(from, last)}`}
        aria-rowcount={rows.length + 1}
        style={{ width: HEAD_PX + spanPx }}
        className="relative"
      >
        <div role="rowgroup" className="sticky top-0 z-20">
          <div role="row" aria-rowindex={1} className="flex border-b border-ink-300 bg-paper-deep">
            <div
              role="columnheader"
              className="sticky left-0 z-10 flex shrink-0 items-end border-r border-ink-300 bg-paper-deep px-3 pb-1 text-sm font-semibold text-ink-800"
              style={{ width: HEAD_PX }}
            >
              Kit or item
            </div>
            <div role="columnheader" aria-label={`Days ${formatDateRange(from, last)}`} className="shrink-0" style={{ width: spanPx }}>
              <div aria-hidden="true" className="flex">
                {Array.from({ length: weeks }, (_, w) => (
                  <div key={w} className="truncate border-l border-ink-300 px-1.5 pt-1 text-xs font-semibold text-ink-800" style={{ width: 7 * dayPx }}>
                    Week of {formatCalendarDate(addDays(from, w * 7))}
                  </div>
                ))}
              </div>
              <div aria-hidden="true" className="flex">
                {Array.from({ length: days }, (_, d) => {
                  const date = parseISO(addDays(from, d));
                  const isToday = d === todayIndex;
                  return (
                    <div
                      key={d}
                      className={`flex flex-col items-center border-l border-paper-line pb-0.5 text-[11px] leading-tight ${d % 7 >= 5 ? 'text-ink-500' : 'text-ink-800'} ${isToday ? 'bg-brass font-bold text-ink-950' : ''}`}
                      style={{ width: dayPx }}
                    >
                      <span>{format(date, 'EEEEE')}</span>
                      <span className="font-mono">{format(date, 'd')}</span>
                    </div>
                  );
                })}
              </div>
            </div>
          </div>
        </div>
        <div role="rowgroup" className="relative">
          {todayIndex >= 0 && todayIndex < days ? (
            <div
              aria-hidden="true"
              title={`Today, ${formatCalendarDate(today)}`}
              className="pointer-events-none absolute top-0 bottom-0 z-[1] border-x-2 border-brass/70 bg-brass/10"
              style={{ left: HEAD_PX + todayIndex * dayPx, width: dayPx }}
            />
          ) : null}
          {rows.map((row, i) => (
            <BoardRow
              key={row.key}
              row={row}
              rowIndex={i + 2}
              bookings={rowBookings.get(row.key) ?? noBookings}
              from={from}
              days={days}
              dayPx={dayPx}
              today={today}
              canBook={canBook}
              collapsed={row.kind === 'kit' && collapsed.has(row.kitId)}
              onToggle={toggleKit}
              pick={pick && pick.rowKey === row.key ? pick : null}
              setPick={setPick}
              finishPick={finishPick}
              bookHref={bookHref}
            />
          ))}
        </div>
      </div>
      {focused && !pick ? (
        <p aria-hidden="true" className="sticky bottom-0 left-0 z-20 border-t border-ink-300 bg-paper-deep px-3 py-1.5 text-sm font-semibold text-ink-900">
          {focused}
        </p>
      ) : null}
      {pick && !pick.dragging ? (
        <p role="status" className="sticky bottom-0 left-0 z-20 border-t border-brass-deep bg-brass-wash px-3 py-1.5 text-sm font-semibold text-ink-900">
          From {formatCalendarDate(addDays(from, pick.anchor))}: click the last day of the booking (the same day again for one day). Escape lets go.
        </p>
      ) : null}
    </div>
  );
}

/** A kit's row shows its own bookings; folded, it also shows its members' separate bookings. */
function kitRowBookings(row: KitRow, index: { byAsset: Map<string, BookingView[]>; byKit: Map<string, BookingView[]> }, folded: boolean): BookingView[] {
  const own = index.byKit.get(row.kitId) ?? [];
  if (!folded) return own;
  const seen = new Set(own.map((b) => b.id));
  const all = [...own];
  for (const member of row.members) {
    for (const booking of index.byAsset.get(member.id) ?? []) {
      if (!seen.has(booking.id)) {
        seen.add(booking.id);
        all.push(booking);
      }
    }
  }
  return all;
}

interface BoardRowProps {
  row: Row;
  rowIndex: number;
  bookings: BookingView[];
  from: string;
  days: number;
  dayPx: number;
  today: string;
  canBook: boolean;
  collapsed: boolean;
  onToggle: (kitId: string) => void;
  pick: Pick | null;
  setPick: (update: (prev: Pick | null) => Pick | null) => void;
  finishPick: (row: Row, a: number, b: number) => void;
  bookHref: BookingBoardProps['bookHref'];
}

const BoardRow = memo(function BoardRow({
  row,
  rowIndex,
  bookings,
  from,
  days,
  dayPx,
  today,
  canBook,
  collapsed,
  onToggle,
  pick,
  setPick,
  finishPick,
  bookHref,
}: BoardRowProps) {
  const rowAssets = useMemo(() => (row.kind === 'kit' ? row.members : [row.asset]), [row]);
  const timeZone = useFirmFormat().timeZone;
  const { bars, lanes } = useMemo(() => layoutBars(bookings, from, days, today, rowAssets, timeZone), [bookings, from, days, today, rowAssets, timeZone]);
  const height = lanes * LANE_PX + ROW_PAD_PX * 2;
  const last = addDays(from, days - 1);

  const dueMarks = useMemo(() => {
    const marks = new Map<string, string[]>();
    for (const a of rowAssets) {
      const dueOn = a.calibration.required ? a.calibration.dueOn : null;
      if (dueOn && dueOn >= from && dueOn <= last) marks.set(dueOn, [...(marks.get(dueOn) ?? []), a.assetTag]);
    }
    return [...marks.entries()];
  }, [rowAssets, from, last]);

  const held = rowAssets.filter((a) => a.status === 'held');
  const atLab = rowAssets.filter((a) => a.status === 'at_lab');
  const rowPattern =
    row.kind === 'asset'
      ? row.asset.status === 'held'
        ? 'nk-board-held'
        : row.asset.status === 'at_lab'
          ? 'nk-board-away'
          : 'nk-board-days'
      : 'nk-board-days';

  const dayAt = (e: ReactPointerEvent<HTMLDivElement>) => {
    const rect = e.currentTarget.getBoundingClientRect();
    return Math.min(days - 1, Math.max(0, Math.floor((e.clientX - rect.left) / dayPx)));
  };
  const onBar = (e: ReactPointerEvent) => (e.target as HTMLElement).closest('[data-bar]') !== null;

  const pointerHandlers = canBook
    ? {
        onPointerDown: (e: ReactPointerEvent<HTMLDivElement>) => {
          if (e.button !== 0 || onBar(e)) return;
          e.preventDefault();
          const day = dayAt(e);
          if (pick && !pick.dragging) {
            finishPick(row, pick.anchor, day);
            return;
          }
          e.currentTarget.setPointerCapture?.(e.pointerId);
          setPick(() => ({ rowKey: row.key, anchor: day, current: day, dragging: true }));
        },
        onPointerMove: (e: ReactPointerEvent<HTMLDivElement>) => {
          if (!pick?.dragging) return;
          const day = dayAt(e);
          if (day !== pick.current) setPick((prev) => (prev ? { ...prev, current: day } : prev));
        },
        onPointerUp: (e: ReactPointerEvent<HTMLDivElement>) => {
          if (!pick?.dragging) return;
          const day = dayAt(e);
          if (day !== pick.anchor) finishPick(row, pick.anchor, day);
          // A click without a drag: the anchor waits for a second click on the last day.
          else setPick((prev) => (prev ? { ...prev, dragging: false } : prev));
        },
      }
    : {};

  const label = row.kind === 'kit' ? row.name : row.asset.assetTag;
  const keyboardStart = today > from && today <= last ? today : from;
  const target: BoardTarget = row.kind === 'kit' ? { kitId: row.kitId } : { assetId: row.asset.id };

  return (
    <div role="row" aria-rowindex={rowIndex} className={`nk-board-row flex border-b border-paper-line ${row.kind === 'kit' ? 'bg-paper' : ''}`}>
      <div
        role="rowheader"
        className={`sticky left-0 z-10 flex shrink-0 items-center gap-1.5 border-r border-ink-300 px-2 ${row.kind === 'kit' ? 'bg-paper-deep' : 'bg-card'}`}
        style={{ width: HEAD_PX, minHeight: height }}
      >
        {row.kind === 'kit' ? (
          <>
            <button
              type="button"
              aria-expanded={!collapsed}
              onClick={() => onToggle(row.kitId)}
              className="flex min-h-8 min-w-0 flex-1 items-center gap-1.5 rounded text-left font-semibold text-ink-900 hover:bg-brass-wash"
            >
              <span aria-hidden="true" className="inline-block w-3 text-ink-700">
                {collapsed ? '▸' : '▾'}
              </span>
              <span className="truncate">{row.name}</span>
              <span className="shrink-0 text-xs font-normal text-ink-700">
                {row.members.length} {row.members.length === 1 ? 'item' : 'items'}
                {held.length ? `, ${held.length} on hold` : ''}
              </span>
            </button>
          </>
        ) : (
          <div className={`flex min-w-0 flex-1 items-center gap-1.5 ${row.inKit ? 'pl-4' : ''}`}>
            <Link
              to={`/fleet/${row.asset.id}`}
              className="shrink-0 font-mono text-sm font-semibold text-ink-900 underline-offset-2 hover:underline whitespace-nowrap"
            >
              {row.asset.assetTag}
            </Link>
            <span className="min-w-0 truncate text-xs text-ink-700">{assetTypeTitles[row.asset.type]}</span>
            {row.asset.status === 'held' ? <StatusChip tone="bad" label="On hold" className="ml-auto shrink-0 !px-1.5 !text-xs" /> : null}
            {row.asset.status === 'at_lab' ? <StatusChip tone="paused" label="At the lab" className="ml-auto shrink-0 !px-1.5 !text-xs" /> : null}
          </div>
        )}
        {canBook ? (
          <Link
            to={bookHref(target, keyboardStart, addDays(keyboardStart, 4))}
            aria-label={`Book ${label}`}
            title={`Book ${label}`}
            className="shrink-0 rounded p-1 text-brass-deep hover:bg-brass-wash"
          >
            <PlusIcon size={14} />
          </Link>
        ) : null}
      </div>
      <div
        role="cell"
        className={`relative shrink-0 select-none ${rowPattern} ${canBook ? 'cursor-crosshair' : ''}`}
        style={{ width: days * dayPx, height, touchAction: canBook ? 'pan-y' : undefined }}
        {...pointerHandlers}
      >
        {atLab.length && row.kind === 'kit' ? <span className="sr-only">{atLab.map((a) => a.assetTag).join(', ')} at the lab.</span> : null}
        {held.length ? <span className="sr-only">{held.map((a) => a.assetTag).join(', ')} on hold.</span> : null}
        {pick ? (
          <div
            aria-hidden="true"
            className="nk-board-pick pointer-events-none absolute top-1 bottom-1 rounded"
            style={{ left: Math.min(pick.anchor, pick.current) * dayPx, width: (Math.abs(pick.current - pick.anchor) + 1) * dayPx }}
          />
        ) : null}
        {bars.map((bar) => (
          <Bar key={bar.booking.id} bar={bar} from={from} days={days} dayPx={dayPx} />
        ))}
        {dueMarks.map(([dueOn, tags]) => {
          const d = differenceInCalendarDays(parseISO(dueOn), parseISO(from));
          const words = `${tags.join(', ')} calibration due ${formatCalendarDate(dueOn)}`;
          return (
            <span
              key={dueOn}
              role="img"
              aria-label={words}
              title={words}
              className="absolute top-0 z-[3] flex h-4 w-4 items-center justify-center rounded-full border border-warn bg-warn-wash text-warn"
              style={{ left: d * dayPx + dayPx - 16 }}
            >
              <ClockIcon size={11} />
            </span>
          );
        })}
      </div>
    </div>
  );
});

function Bar({ bar, from, days, dayPx }: { bar: BarModel; from: string; days: number; dayPx: number }) {
  const { booking } = bar;
  const name = barName(bar);
  const startsBefore = booking.startsOn < from;
  const endsAfter = bar.endsAfter;
  const state = booking.state === 'cancelled' ? 'returned' : booking.state;
  const remainder = bar.remainder ? (
    <span
      aria-hidden="true"
      data-planned-remainder=""
      title={`Planned until ${formatCalendarDate(booking.endsOn)}, back early on ${formatCalendarDate(bar.returnedEarlyOn ?? booking.endsOn)}`}
      className="nk-bar-remainder pointer-events-none absolute z-[1] rounded-r-md"
      style={{
        left: bar.remainder.first * dayPx + 1,
        width: (bar.remainder.last - bar.remainder.first + 1) * dayPx - 2,
        top: ROW_PAD_PX + bar.lane * LANE_PX,
        height: LANE_PX - 4,
      }}
    />
  ) : null;
  if (bar.first < 0) return remainder;
  return (
    <>
      {remainder}
      <Link
        data-bar=""
        to={`/bookings/${booking.id}`}
        aria-label={name}
        title={name}
        className={`nk-bar nk-bar-${state} ${bar.dueTags.length ? 'nk-bar-due' : ''} absolute z-[2] flex items-center gap-1 overflow-hidden px-1.5 text-xs font-semibold whitespace-nowrap ${startsBefore ? 'rounded-l-none border-l-0' : 'rounded-l-md'} ${endsAfter ? 'rounded-r-none border-r-0' : 'rounded-r-md'}`}
        style={{ left: bar.first * dayPx + 1, width: (bar.last - bar.first + 1) * dayPx - 2, top: ROW_PAD_PX + bar.lane * LANE_PX, height: LANE_PX - 4 }}
      >
        {startsBefore ? <span aria-hidden="true">◂</span> : null}
        {bar.dueTags.length ? <AlertIcon size={12} className="shrink-0" /> : null}
        <span className="truncate">{bookingTitle(booking)}</span>
        {bar.late ? ' ' : null}
        {bar.late ? <span className="ml-1 shrink-0 rounded-sm bg-bad px-1 text-[10px] tracking-wide text-card uppercase">Late</span> : null}
        {endsAfter ? (
          <span aria-hidden="true" className="ml-auto">
            ▸
          </span>
        ) : null}
      </Link>
    </>
  );
}
