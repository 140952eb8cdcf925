import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { AssetStatusChip, CalibrationChip } from '../../../components/asset-status';
import { Button } from '../../../components/button';
import { PlusIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { SearchBox } from '../../../components/search-box';
import { isApiError } from '../../../lib/api-client';
import { assetTypeTitles } from '../../../lib/assets';
import { formatCalendarDate } from '../../../lib/format';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useKitCandidates } from '../api/get-kit-candidates';
import type { AssetView, KitWithMembersView } from '../../../../shared/assets/views';
import { memberConflicts, useUpdateKit } from '../api/update-kit';

/** The members at a glance: one card each with its status and calibration. */
function MemberCard({ asset, onRemove, busy }: { asset: AssetView; onRemove?: () => void; busy: boolean }) {
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-3">
      <div className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          <Link to={`/fleet/${asset.id}`} className="font-mono text-base font-semibold text-ink-900 underline decoration-brass whitespace-nowrap">
            {asset.assetTag}
          </Link>
          <p className="truncate text-sm text-ink-700">
            {assetTypeTitles[asset.type]}
            {asset.model ? ` · ${asset.model}` : ''}
          </p>
        </div>
        {onRemove ? (
          <Button size="sm" variant="quiet" onClick={onRemove} disabled={busy} aria-label={`Remove ${asset.assetTag} from the kit`}>
            Remove
          </Button>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-1.5">
        <AssetStatusChip status={asset.status} />
        <CalibrationChip state={asset.calibration.state} dueOn={asset.calibration.dueOn} />
      </div>
      {asset.calibration.dueOn ? <p className="text-sm text-ink-700">Due {formatCalendarDate(asset.calibration.dueOn)}</p> : null}
    </li>
  );
}

function AddMembers({ onAdd, busy }: { onAdd: (asset: AssetView) => void; busy: boolean }) {
  const searchId = useId();
  const [text, setText] = useState('');
  const q = useDebouncedValue(text);
  const candidates = useKitCandidates(q);

  return (
    <section aria-labelledby={`${searchId}-h`} className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4">
      <h2 id={`${searchId}-h`} className="text-lg font-bold">
        Add members
      </h2>
      <SearchBox label="Search items not in a kit" value={text} onChange={setText} placeholder="Tag, serial, maker or model" />
      {candidates.isError ? <Notice tone="error">{candidates.error.message}</Notice> : null}
      {candidates.data ? (
        candidates.data.items.length ? (
          <ul className="flex max-h-80 flex-col divide-y divide-paper-line overflow-auto">
            {candidates.data.items.map((asset) => (
              <li key={asset.id} className="flex items-center gap-3 py-1.5">
                <span className="min-w-0 flex-1">
                  <span className="font-mono font-semibold whitespace-nowrap">{asset.assetTag}</span>{' '}
                  <span className="text-sm text-ink-700">
                    {assetTypeTitles[asset.type]}
                    {asset.model ? ` · ${asset.model}` : ''}
                  </span>
                </span>
                <CalibrationChip state={asset.calibration.state} dueOn={asset.calibration.dueOn} />
                <Button size="sm" icon={<PlusIcon size={14} />} disabled={busy} onClick={() => onAdd(asset)} aria-label={`Add ${asset.assetTag}`}>
                  Add
                </Button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-ink-700">{q ? 'No free item matches.' : 'Every item is already in a kit.'}</p>
        )
      ) : null}
      {candidates.data && candidates.data.total > candidates.data.items.length ? (
        <p className="text-sm text-ink-700">
          Showing {candidates.data.items.length} of {candidates.data.total}; search to narrow down.
        </p>
      ) : null}
    </section>
  );
}

/** The kit's members as cards; members can be added and removed by those who may change the fleet. */
export function KitMembers({
  kit,
  canWrite,
  onMembersChanged,
}: {
  kit: KitWithMembersView;
  canWrite: boolean;
  /** Told after a member was added or removed (other views show kit membership too). */
  onMembersChanged?: () => void;
}) {
  const update = useUpdateKit();
  const [outcome, setOutcome] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);

  const setMembers = (ids: string[], done: string) => {
    setOutcome(null);
    update.mutate(
      { id: kit.id, changes: { memberIds: ids } },
      {
        onSuccess: () => {
          setOutcome({ tone: 'success', text: done });
          onMembersChanged?.();
        },
        onError: (error) => {
          const conflicts = memberConflicts(error);
          setOutcome({
            tone: 'error',
            text: conflicts.length
              ? `Already in another kit: ${conflicts.map((c) => `${c.assetTag} (in ${c.kitName})`).join(', ')}. Remove it there first.`
              : isApiError(error)
                ? error.message
                : 'The change was not saved. Try again.',
          });
        },
      },
    );
  };

  const ids = kit.members.map((m) => m.id);

  return (
    <div className="flex flex-col gap-4">
      <section aria-labelledby="kit-members-heading" className="flex flex-col gap-2">
        <h2 id="kit-members-heading" className="text-lg font-bold">
          Members <span className="font-normal text-ink-500">({kit.members.length})</span>
        </h2>
        {outcome ? <Notice tone={outcome.tone}>{outcome.text}</Notice> : null}
        {kit.members.length ? (
          <ul className="grid gap-2 sm:grid-cols-2 xl:grid-cols-3">
            {kit.members.map((asset) => (
              <MemberCard
                key={asset.id}
                asset={asset}
                busy={update.isPending}
                onRemove={
                  canWrite
                    ? () =>
                        setMembers(
                          ids.filter((id) => id !== asset.id),
                          `${asset.assetTag} is no longer in ${kit.name}.`,
                        )
                    : undefined
                }
              />
            ))}
          </ul>
        ) : (
          <p className="text-ink-700">No members yet.{canWrite ? ' Add the items that travel together below.' : ''}</p>
        )}
      </section>
      {canWrite ? <AddMembers busy={update.isPending} onAdd={(asset) => setMembers([...ids, asset.id], `${asset.assetTag} added to ${kit.name}.`)} /> : null}
    </div>
  );
}
