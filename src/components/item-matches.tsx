import { Button } from './button';

/** Search results that can be added, each with its own "Add" button (or a `note` saying why not); `none` says that nothing matched. */
export function ItemMatches({
  items,
  none,
  onAdd,
}: {
  items: { id: string; tag: string; detail: string; kitName?: string; note?: string }[];
  none: string;
  onAdd: (id: string) => void;
}) {
  if (!items.length) return <p className="text-sm text-ink-700">{none}</p>;
  return (
    <ul className="flex flex-col divide-y divide-paper-line rounded-md border border-paper-line">
      {items.map((item) => (
        <li key={item.id} className="flex items-center gap-2 px-2 py-1">
          <span className="font-mono text-sm font-semibold whitespace-nowrap">{item.tag}</span>
          <span className="min-w-0 flex-1 truncate text-sm text-ink-700">
            {item.detail}
            {item.kitName ? ` · in ${item.kitName}` : ''}
          </span>
          {item.note ? (
            <span className="inline-flex min-h-8 items-center px-2.5 text-sm text-ink-500">{item.note}</span>
          ) : (
            <Button size="sm" onClick={() => onAdd(item.id)}>
              Add {item.tag}
            </Button>
          )}
        </li>
      ))}
    </ul>
  );
}
