import type { DepositState, AuthorizationState } from '../../shared/billing/views';
import { ClockIcon } from './icons';
import { StatusChip, type StatusTone } from './status-chip';

const holdStates: Record<AuthorizationState, [string, StatusTone]> = {
  authorized: ['Authorized', 'info'],
  captured: ['Captured', 'ok'],
  released: ['Released', 'ok'],
  lapsed: ['Lapsed', 'warn'],
  declined: ['Declined', 'bad'],
  replaced: ['Renewed', 'none'],
};
const noDeposit: [string, StatusTone] = ['No card authorization yet', 'none'];
const depositEntry = (state: DepositState | AuthorizationState) => (state === 'none' ? noDeposit : holdStates[state]);
export const depositStateWord = (state: DepositState | AuthorizationState) => depositEntry(state)[0];

/** A rental's deposit, or one card hold, as a chip (rental lists and the deposit panel). */
export function DepositStateChip({ state }: { state: DepositState | AuthorizationState }) {
  const [label, tone] = depositEntry(state);
  return <StatusChip tone={tone} label={label} />;
}

const SOON_MS = 48 * 3600 * 1000;
/** Within 48 hours of lapsing (or past it): the clerk should act. */
export const lapsesSoon = (at: string | null) => !!at && new Date(at).getTime() - Date.now() <= SOON_MS;

/** When a card hold lapses; within 48 hours it says so in words with a clock, past it says "lapsed". */
export function AuthorizationLapse({ at, dateTime }: { at: string | null; dateTime: (value: string) => string }) {
  if (!at) return <span>—</span>;
  const left = new Date(at).getTime() - Date.now();
  if (left > SOON_MS) return <time dateTime={at}>{dateTime(at)}</time>;
  return (
    <span className="inline-flex items-center gap-1 rounded border border-warn/40 bg-warn-wash px-1.5 font-semibold text-warn">
      <ClockIcon size={13} />
      <span>{left > 0 ? 'Lapses soon:' : 'Lapsed:'}</span>
      <time dateTime={at} className="text-ink-900">
        {dateTime(at)}
      </time>
    </span>
  );
}
