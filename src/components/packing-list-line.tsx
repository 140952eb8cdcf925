/** The tags of the kit chosen in a form, in one line; nothing until a kit is chosen. */
export function PackingListLine({ tags }: { tags: string[] }) {
  if (!tags.length) return null;
  return (
    <p className="text-sm text-ink-700">
      <span className="font-semibold text-ink-800">Packing list: </span>
      <span className="font-mono">{tags.join(', ')}</span>
    </p>
  );
}
