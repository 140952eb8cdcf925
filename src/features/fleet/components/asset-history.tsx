import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { useFirmFormat } from '../../../lib/format';
import { useAssetHistory } from '../api/get-asset-history';
import { Panel } from './asset-facts';

/** Changes to the record and hand-overs, newest first. */
export function AssetHistory({ assetId }: { assetId: string }) {
  const history = useAssetHistory(assetId);
  const { dateTime } = useFirmFormat();
  return (
    <Panel title="History">
      {history.isPending ? <LoadingPanel label="Loading the history…" /> : null}
      {history.isError ? (
        <Notice tone="error" title="The history could not be loaded">
          {history.error.message}
        </Notice>
      ) : null}
      {history.data && history.data.items.length === 0 ? <p className="text-ink-700">Nothing recorded yet.</p> : null}
      {history.data && history.data.items.length ? (
        <ol className="flex flex-col divide-y divide-paper-line">
          {history.data.items.map((entry, i) => (
            <li key={`${entry.at}-${i}`} className="flex flex-col gap-0.5 py-2 sm:flex-row sm:gap-4">
              <time dateTime={entry.at} className="shrink-0 text-sm text-ink-700 sm:w-44">
                {dateTime(entry.at)}
              </time>
              <div className="min-w-0">
                <p className="text-ink-900">{entry.summary}</p>
                <p className="text-sm text-ink-500">
                  {entry.source === 'custody' ? 'Custody' : 'Record change'}
                  {entry.actorName ? ` · ${entry.actorName}` : ''}
                </p>
              </div>
            </li>
          ))}
        </ol>
      ) : null}
    </Panel>
  );
}
