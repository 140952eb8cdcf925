import { Link } from 'react-router-dom';
import { AssetStatusChip } from '../../../components/asset-status';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { assetTypeTitles } from '../../../lib/assets';
import { formatCount } from '../../../lib/format';
import { useAssets } from '../api/get-assets';

/** Items on hold (after an incident, a failed check or by hand), waiting for evidence and a release. */
export function HeldItems() {
  const held = useAssets({ status: ['held'], sort: '-updatedAt', limit: 8, offset: 0 });
  return (
    <section aria-labelledby="held-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="held-heading" className="text-base font-semibold text-ink-900">
          On hold
        </h2>
        {held.data ? (
          <span className="text-sm text-ink-700">
            {held.data.total === 0 ? 'none' : `${formatCount(held.data.total)} ${held.data.total === 1 ? 'item' : 'items'}`}
          </span>
        ) : null}
      </div>
      {held.isPending ? <LoadingPanel label="Looking for held items…" /> : null}
      {held.isError ? <Notice tone="error">{held.error.message}</Notice> : null}
      {held.data && held.data.items.length === 0 ? <p className="text-sm text-ink-700">Nothing is on hold.</p> : null}
      {held.data && held.data.items.length ? (
        <>
          <ul className="flex flex-col divide-y divide-paper-line">
            {held.data.items.map((asset) => (
              <li key={asset.id}>
                <Link to={`/fleet/${asset.id}`} className="flex min-h-11 items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
                  <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{asset.assetTag}</span>
                  <span className="min-w-0 truncate text-sm text-ink-700">{assetTypeTitles[asset.type]}</span>
                  <span className="ml-auto shrink-0">
                    <AssetStatusChip status={asset.status} />
                  </span>
                </Link>
              </li>
            ))}
          </ul>
          {held.data.total > held.data.items.length ? (
            <Link to="/fleet?status=held" className="mt-2 inline-block text-sm font-semibold text-brass-deep underline">
              See all {formatCount(held.data.total)} held items
            </Link>
          ) : null}
        </>
      ) : null}
    </section>
  );
}
