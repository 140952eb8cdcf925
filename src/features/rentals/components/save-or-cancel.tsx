import { Button } from '../../../components/button';

/** A form's submit button and its way out. */
export function SaveOrCancel({ label, busy, onCancel }: { label: string; busy: boolean; onCancel: () => void }) {
  return (
    <div className="flex flex-wrap gap-2">
      <Button type="submit" variant="primary" busy={busy}>
        {label}
      </Button>
      <Button variant="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
