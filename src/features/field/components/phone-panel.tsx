import { Link } from 'react-router-dom';
import { unsent, useOutbox } from '../../../lib/field/use-field-state';
import { useStoredCopy } from '../api/get-field-copy';
import { CopyAge } from './copy-age';
import { FieldKitPanels } from './field-kit';

/** The technician's "on this phone" line: how old the kit copy is, and what waits to be sent. */
export function PhonePanel() {
  const records = useOutbox();
  const waiting = unsent(records);
  return (
    <section aria-label="On this phone" className="mb-4 flex flex-col gap-1 rounded-lg border border-paper-line bg-card px-4 py-3">
      <CopyAge />
      <Link to="/outbox" className="text-sm font-semibold text-brass-deep underline">
        {waiting.length ? `${waiting.length} record${waiting.length === 1 ? '' : 's'} on this phone not sent yet` : 'Records sent from this phone'}
      </Link>
    </section>
  );
}

/** The home panels without signal, from this phone's copy. */
export function FieldHomePanels() {
  const stored = useStoredCopy();
  if (!stored.data) return null;
  return <FieldKitPanels stored={stored.data} />;
}
