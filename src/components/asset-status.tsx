import type { AssetStatus } from '../lib/assets';
import type { CalibrationState } from '../lib/calibration';
import { ClockIcon } from './icons';
import { StatusChip, type StatusTone } from './status-chip';

/** Where an asset physically is, as a word plus an icon. */
export const assetStatusWords: Record<AssetStatus, string> = {
  ready: 'Ready',
  out: 'Out',
  at_lab: 'At the lab',
  held: 'Held',
  retired: 'Retired',
};
const assetStatusTones: Record<AssetStatus, StatusTone> = {
  ready: 'ok',
  out: 'info',
  at_lab: 'paused',
  held: 'bad',
  retired: 'none',
};

export function AssetStatusChip({ status }: { status: AssetStatus }) {
  return <StatusChip tone={assetStatusTones[status]} label={assetStatusWords[status]} />;
}

/** Calibration state, as a word plus an icon. */
export const calibrationWords: Record<CalibrationState, string> = {
  current: 'Current',
  due_soon: 'Due soon',
  overdue: 'Overdue',
  not_required: 'Not required',
};
const calibrationTones: Record<CalibrationState, StatusTone> = {
  current: 'ok',
  due_soon: 'warn',
  overdue: 'bad',
  not_required: 'none',
};

export function CalibrationChip({ state, dueOn }: { state: CalibrationState; dueOn?: string | null }) {
  if (state === 'due_soon') {
    return (
      <span className="inline-flex items-center gap-1 rounded-full border border-warn/40 bg-warn-wash px-2 py-px text-sm font-semibold leading-5 whitespace-nowrap text-warn">
        <ClockIcon size={13} />
        <span>{calibrationWords[state]}</span>
      </span>
    );
  }
  return (
    <StatusChip tone={calibrationTones[state]} label={calibrationWords[state]} title={state === 'overdue' && !dueOn ? 'No calibration on record' : undefined} />
  );
}
