import { Link } from 'react-router-dom';
import { ClockIcon } from '../../../components/icons';
import { unsent, useOutbox } from '../../../lib/field/use-field-state';

/** The top bar's count of records on this phone that have not reached the server; nothing when none wait. */
export function OutboxBadge() {
  const records = unsent(useOutbox());
  if (!records.length) return null;
  const refused = records.filter((r) => r.state === 'refused').length;
  const waiting = records.length - refused;
  const label = [waiting ? `${waiting} to send` : '', refused ? `${refused} refused` : ''].filter(Boolean).join(' · ');
  return (
    <Link
      to="/outbox"
      aria-label={`Records on this phone: ${label}`}
      className={`inline-flex min-h-9 shrink-0 items-center gap-1 rounded-full border px-3 text-sm font-semibold ${
        refused ? 'border-bad bg-bad text-paper' : 'border-brass bg-brass text-ink-950'
      }`}
    >
      <ClockIcon size={14} />
      {label}
    </Link>
  );
}
