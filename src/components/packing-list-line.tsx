import { Fragment } from 'react';

/** The tags of the kit chosen in a form, in one line; nothing until a kit is chosen. Lines break between tags, never inside one. */
export function PackingListLine({ tags }: { tags: string[] }) {
  if (!tags.length) return null;
  return (
    <p className="text-sm text-ink-700">
      <span className="font-semibold text-ink-800">Packing list: </span>
      <span className="font-mono">
        {tags.map((tag, i) => (
          <Fragment key={tag}>
            {i ? ', ' : ''}
            <span className="whitespace-nowrap">{tag}</span>
          </Fragment>
        ))}
      </span>
    </p>
  );
}
