import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { FactList, Panel } from '../../../components/panel';
import { StatusChip } from '../../../components/status-chip';
import { useFirmFormat } from '../../../lib/format';
import { useHolds } from '../api/get-holds';
import { missingEvidence, useReleaseAsset } from '../api/release-asset';
import { holdReasonWords, releaseRule, tipPositionsOf, type HeldAsset } from './hold-words';

/**
 * An item on hold: why, since when, and — for those who may — the release,
 * which the server grants only on evidence recorded since the hold began.
 */
export function HoldPanel({ asset, canRelease, className = '' }: { asset: HeldAsset; canRelease: boolean; className?: string }) {
  const { id: assetId, assetTag } = asset;
  const holds = useHolds(assetId);
  const release = useReleaseAsset();
  const { dateTime } = useFirmFormat();
  const [note, setNote] = useState('');
  const noteId = useId();
  const current = holds.data?.items.find((h) => !h.releasedAt);
  const missing = release.error ? missingEvidence(release.error) : null;

  return (
    <Panel title="On hold" className={`border-bad/50 ${className}`} actions={<StatusChip tone="bad" label="Held" />}>
      {holds.isPending ? <LoadingPanel label="Loading the hold…" /> : null}
      {holds.isError ? <Notice tone="error">{holds.error.message}</Notice> : null}
      {holds.data && !current ? <p className="text-sm text-ink-700">No open hold is on record for this item.</p> : null}
      {current ? (
        <div className="flex flex-col gap-3">
          <FactList
            items={[
              { term: 'Reason', value: holdReasonWords[current.reason] },
              { term: 'What happened', value: current.summary },
              { term: 'Held since', value: dateTime(current.startedAt) },
              ...(current.incidentId
                ? [
                    {
                      term: 'Report',
                      value: (
                        <Link className="font-semibold text-brass-deep underline" to={`/incidents/${current.incidentId}`}>
                          Open the damage report
                        </Link>
                      ),
                    },
                  ]
                : []),
              ...(current.checkId
                ? [
                    {
                      term: 'Check',
                      value: (
                        <Link className="font-semibold text-brass-deep underline" to={`/checks/${current.checkId}`}>
                          Open the failed check
                        </Link>
                      ),
                    },
                  ]
                : []),
            ]}
          />
          <p className="text-sm text-ink-700">
            {assetTag} cannot be booked or sent out. {releaseRule(asset.type, tipPositionsOf(asset.specs))}
          </p>
          {canRelease ? (
            <div className="flex flex-col gap-2">
              <div className="flex flex-col gap-1 sm:max-w-md">
                <label htmlFor={noteId} className="text-sm font-semibold text-ink-800">
                  Release note (optional)
                </label>
                <input
                  id={noteId}
                  value={note}
                  onChange={(e) => setNote(e.target.value)}
                  className="min-h-10 rounded-md border border-paper-line bg-card px-3"
                  autoComplete="off"
                />
              </div>
              <div>
                <Button
                  variant="primary"
                  className="min-h-11"
                  busy={release.isPending}
                  onClick={() => release.mutate({ assetId, note: note.trim() || undefined })}
                >
                  Release
                </Button>
              </div>
              {missing ? (
                <Notice tone="error" title={`${assetTag} stays on hold — why it cannot be released yet`}>
                  <ul className="list-disc pl-5">
                    {(missing.length ? missing : [release.error?.message ?? '']).map((m) => (
                      <li key={m}>{m.charAt(0).toUpperCase() + m.slice(1)}.</li>
                    ))}
                  </ul>
                  <p className="mt-1">Record the missing check (or the calibration), then release again.</p>
                </Notice>
              ) : release.isError ? (
                <Notice tone="error" title="Not released">
                  {release.error.message}
                </Notice>
              ) : null}
            </div>
          ) : (
            <p className="text-sm text-ink-700">A shop manager or the owner releases held items.</p>
          )}
        </div>
      ) : null}
    </Panel>
  );
}
