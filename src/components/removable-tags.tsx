import { CrossIcon } from './icons';

/** Chosen items as tags (mono) with a few words each, each with its own remove button. */
export function RemovableTags({
  label,
  items,
  onRemove,
}: {
  label: string;
  items: { id: string; tag: string; detail: string }[];
  onRemove: (id: string) => void;
}) {
  if (!items.length) return null;
  return (
    <ul aria-label={label} className="flex flex-wrap gap-2">
      {items.map((item) => (
        <li key={item.id} className="inline-flex max-w-full items-center gap-1 rounded-full border border-paper-line bg-paper px-2 py-0.5 text-sm">
          <span className="font-mono font-semibold whitespace-nowrap">{item.tag}</span>
          <span className="min-w-0 text-ink-700">{item.detail}</span>
          <button type="button" aria-label={`Remove ${item.tag}`} onClick={() => onRemove(item.id)} className="rounded p-0.5 text-ink-700 hover:bg-paper-deep">
            <CrossIcon size={14} />
          </button>
        </li>
      ))}
    </ul>
  );
}
