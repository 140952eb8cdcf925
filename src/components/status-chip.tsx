import type { ReactNode } from 'react';
import { AlertIcon, CheckIcon, CrossIcon, DashIcon, InfoIcon, PauseIcon, SpinnerIcon } from './icons';

/**
 * A status is always a word plus an icon (and, for the worst states, a hatch),
 * never colour alone.
 */
export type StatusTone = 'ok' | 'warn' | 'bad' | 'info' | 'paused' | 'busy' | 'none';

const tones: Record<StatusTone, { classes: string; icon: ReactNode }> = {
  ok: { classes: 'bg-ok-wash text-ok border-ok/40', icon: <CheckIcon size={13} /> },
  warn: { classes: 'bg-warn-wash text-warn border-warn/40', icon: <AlertIcon size={13} /> },
  bad: { classes: 'bg-bad-wash text-bad border-bad/50 nk-hatch', icon: <CrossIcon size={13} /> },
  info: { classes: 'bg-info-wash text-info border-info/40', icon: <InfoIcon size={13} /> },
  paused: { classes: 'bg-paper-deep text-ink-700 border-ink-300 border-dashed', icon: <PauseIcon size={13} /> },
  busy: { classes: 'bg-info-wash text-info border-info/40', icon: <SpinnerIcon size={13} /> },
  none: { classes: 'bg-paper-deep text-ink-700 border-paper-line', icon: <DashIcon size={13} /> },
};

export interface StatusChipProps {
  tone: StatusTone;
  /** The word people read; also what a CSV export should carry. */
  label: string;
  title?: string;
  className?: string;
}

export function StatusChip({ tone, label, title, className = '' }: StatusChipProps) {
  const t = tones[tone];
  return (
    <span
      title={title}
      className={`inline-flex items-center gap-1 rounded-full border px-2 py-px text-sm font-semibold leading-5 whitespace-nowrap ${t.classes} ${className}`}
    >
      {t.icon}
      <span>{label}</span>
    </span>
  );
}
