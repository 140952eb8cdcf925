import { createContext, useContext, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/button';

type Chosen = { id: string; assetTag: string };
type DueSelection = { chosen: Chosen[]; toggle: (item: Chosen) => void; clear: () => void };

const SelectionContext = createContext<DueSelection | null>(null);

/** The items chosen across the review's tables (overdue and due soon, or per kit) to go to the lab on one trip. */
export function DueSelectionProvider({ children }: { children: ReactNode }) {
  const [chosen, setChosen] = useState<Chosen[]>([]);
  const value = useMemo<DueSelection>(
    () => ({
      chosen,
      toggle: (item) => setChosen((now) => (now.some((c) => c.id === item.id) ? now.filter((c) => c.id !== item.id) : [...now, item])),
      clear: () => setChosen([]),
    }),
    [chosen],
  );
  return <SelectionContext.Provider value={value}>{children}</SelectionContext.Provider>;
}

/** Null outside a provider: the tables then offer no choice. */
export const useDueSelection = () => useContext(SelectionContext);

/** The tick in a row of the review table. */
export function ChooseForTrip({ item }: { item: Chosen }) {
  const selection = useDueSelection();
  if (!selection) return null;
  return (
    <input
      type="checkbox"
      className="size-5 accent-brass-deep"
      aria-label={`Choose ${item.assetTag} for one lab trip`}
      checked={selection.chosen.some((c) => c.id === item.id)}
      onChange={() => selection.toggle(item)}
    />
  );
}

/** "3 chosen: TRK-005, TRK-006, TRK-007 — Plan one trip". */
export function PlanOneTripBar() {
  const selection = useDueSelection();
  if (!selection) return null;
  const { chosen, clear } = selection;
  return (
    <section aria-label="One lab trip" className="flex flex-wrap items-center gap-3 rounded-lg border border-paper-line bg-card px-4 py-3">
      {chosen.length === 0 ? (
        <p className="text-sm text-ink-700">Tick several items below to send them to the lab on one trip.</p>
      ) : (
        <>
          <p className="min-w-0 flex-1">
            <span className="font-semibold">{chosen.length === 1 ? '1 item chosen' : `${chosen.length} items chosen`}:</span>{' '}
            <span className="font-mono">{chosen.map((c) => c.assetTag).join(', ')}</span>
          </p>
          <Button size="sm" onClick={clear}>
            Clear
          </Button>
          <Link to={`/calibration/plan?assets=${chosen.map((c) => c.id).join(',')}`} className={buttonClasses('primary', 'sm')}>
            Plan one trip
          </Link>
        </>
      )}
    </section>
  );
}
