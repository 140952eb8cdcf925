import { Link } from 'react-router-dom';

/** A table row's header cell: the item's tag, linking to its page in the fleet. */
export function AssetRowHeader({ id, tag }: { id: string; tag: string }) {
  return (
    <th scope="row" className="py-1.5 pr-2">
      <Link to={`/fleet/${id}`} className="font-mono font-semibold text-ink-900 underline-offset-2 hover:underline whitespace-nowrap">
        {tag}
      </Link>
    </th>
  );
}
