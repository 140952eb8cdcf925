import { useEffect, useId, useRef, useState } from 'react';
import { calibrationWords, assetStatusWords } from '../../../components/asset-status';
import { Button } from '../../../components/button';
import { DropPanel } from '../../../components/drop-panel';
import { CheckIcon } from '../../../components/icons';
import { SearchBox } from '../../../components/search-box';
import { assetStatuses, assetTypes, assetTypeTitles, type AssetStatus, type AssetType } from '../../../lib/assets';
import { calibrationStates, type CalibrationState } from '../../../lib/calibration';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import type { AssetFilter } from '../api/keys';

export interface KitOption {
  value: string;
  label: string;
}

/** Toggles a value in a list (the chip and checkbox filters). */
function toggle<T>(list: readonly T[] | undefined, value: T): T[] {
  const current = list ?? [];
  return current.includes(value) ? current.filter((v) => v !== value) : [...current, value];
}

function ToggleChip({ pressed, onClick, children }: { pressed: boolean; onClick: () => void; children: string }) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      onClick={onClick}
      className={`inline-flex min-h-9 items-center gap-1 rounded-full border px-3 text-sm font-semibold ${
        pressed ? 'border-brass-deep bg-brass-wash text-ink-900' : 'border-paper-line bg-card text-ink-700 hover:bg-paper-deep'
      }`}
    >
      {pressed ? <CheckIcon size={13} /> : null}
      {children}
    </button>
  );
}

function ChipGroup<T extends string>({
  label,
  options,
  chosen,
  onToggle,
}: {
  label: string;
  options: { value: T; label: string }[];
  chosen: readonly T[] | undefined;
  onToggle: (value: T) => void;
}) {
  return (
    <div role="group" aria-label={label} className="flex flex-wrap items-center gap-1.5">
      <span className="mr-1 text-sm font-semibold text-ink-800">{label}</span>
      {options.map((o) => (
        <ToggleChip key={o.value} pressed={chosen?.includes(o.value) ?? false} onClick={() => onToggle(o.value)}>
          {o.label}
        </ToggleChip>
      ))}
    </div>
  );
}

/**
 * Nestkeeper's own filter bar for the fleet: the server filters, so the grid's
 * column filters stay off. Typing in the search box waits a quarter second.
 */
export function FleetFilterBar({
  filter,
  onChange,
  kitOptions,
}: {
  filter: AssetFilter;
  onChange: (filter: AssetFilter) => void;
  kitOptions: readonly KitOption[];
}) {
  const kitId = useId();
  const [text, setText] = useState(filter.q ?? '');
  const latest = useRef({ filter, onChange });
  latest.current = { filter, onChange };

  // Follow the address bar (back/forward) when it changes the search from outside.
  useEffect(() => setText(filter.q ?? ''), [filter.q]);

  const settledText = useDebouncedValue(text);
  useEffect(() => {
    if (settledText === (latest.current.filter.q ?? '')) return;
    latest.current.onChange({ ...latest.current.filter, q: settledText || undefined });
  }, [settledText]);

  const typeCount = filter.type?.length ?? 0;
  const anyFilter = !!(filter.q || typeCount || filter.status?.length || filter.calibration?.length || filter.kitId);

  return (
    <div className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-3">
      <div className="flex flex-wrap items-end gap-3">
        <SearchBox
          label="Search the fleet"
          value={text}
          onChange={setText}
          placeholder="Tag, serial, RFID, maker, model or location"
          className="min-w-56 flex-1"
        />

        <DropPanel summary={`Type: ${typeCount === 0 ? 'all' : `${typeCount} chosen`}`} summaryClassName="min-h-10 px-3">
          <fieldset className="grid w-64 gap-0.5">
            <legend className="sr-only">Asset types to show</legend>
            {assetTypes.map((type: AssetType) => (
              <label key={type} className="flex min-h-9 items-center gap-2 rounded px-1 hover:bg-paper-deep">
                <input
                  type="checkbox"
                  className="size-4 accent-brass-deep"
                  checked={filter.type?.includes(type) ?? false}
                  onChange={() => onChange({ ...filter, type: toggle(filter.type, type) })}
                />
                {assetTypeTitles[type]}
              </label>
            ))}
          </fieldset>
        </DropPanel>

        <div className="flex flex-col gap-1">
          <label htmlFor={kitId} className="text-sm font-semibold text-ink-800">
            Kit
          </label>
          <select
            id={kitId}
            value={filter.kitId ?? ''}
            onChange={(e) => onChange({ ...filter, kitId: e.target.value || undefined })}
            className="min-h-10 max-w-56 rounded-md border border-paper-line bg-card px-2 text-base"
          >
            <option value="">Any kit or none</option>
            <option value="none">Not in a kit</option>
            {kitOptions.map((k) => (
              <option key={k.value} value={k.value}>
                {k.label}
              </option>
            ))}
          </select>
        </div>

        {anyFilter ? (
          <Button variant="quiet" onClick={() => onChange({})}>
            Clear filters
          </Button>
        ) : null}
      </div>

      <div className="flex flex-wrap gap-x-6 gap-y-2">
        <ChipGroup
          label="Status"
          options={assetStatuses.map((status: AssetStatus) => ({ value: status, label: assetStatusWords[status] }))}
          chosen={filter.status}
          onToggle={(status) => onChange({ ...filter, status: toggle(filter.status, status) })}
        />
        <ChipGroup
          label="Calibration"
          options={calibrationStates.map((state: CalibrationState) => ({ value: state, label: calibrationWords[state] }))}
          chosen={filter.calibration}
          onToggle={(state) => onChange({ ...filter, calibration: toggle(filter.calibration, state) })}
        />
      </div>
    </div>
  );
}
