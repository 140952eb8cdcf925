import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { RecordCheckForm, type CheckCorrection, type FirmCheckSettings } from '../../features/checks/components/record-check-form';
import type { CheckFormValues } from '../../features/checks/components/check-values';
import { useOutboxRecord, useStoredCopy } from '../../features/field/api/get-field-copy';
import { CopyAge } from '../../features/field/components/copy-age';
import { useAsset } from '../../features/fleet/api/get-asset';
import { useAssets } from '../../features/fleet/api/get-assets';
import { useSettings } from '../../features/settings/api/get-settings';
import { assetTypeTitles } from '../../lib/assets';
import { useOnline } from '../../lib/field/use-field-state';
import type { AssetView } from '../../../shared/assets/views';

const usable = { status: ['ready', 'out'] as ('ready' | 'out')[], sort: 'assetTag', limit: 200, offset: 0 };

type Sources = {
  asset: AssetView | null | undefined;
  settings: FirmCheckSettings | undefined;
  probes: AssetView[];
  bars: AssetView[];
  pending: boolean;
  error?: string;
};

/** With signal: the server's item, settings, probes and scale bars. */
function useServerSources(assetId: string, enabled: boolean): Sources {
  const asset = useAsset(assetId);
  const settings = useSettings();
  const type = asset.data?.type;
  const probes = useAssets({ ...usable, type: ['probe'] }, { enabled: enabled && type === 'tip' });
  const bars = useAssets({ ...usable, type: ['scale_bar'] }, { enabled: enabled && type === 'tracker' });
  return {
    asset: asset.data,
    settings: settings.data,
    probes: probes.data?.items ?? [],
    bars: bars.data?.items ?? [],
    pending: asset.isPending || settings.isPending,
    error: (asset.error ?? settings.error)?.message,
  };
}

/** Without signal: the same from this phone's field copy (the kit carried, the firm's tolerances and decision rule). */
function useFieldSources(assetId: string): Sources {
  const stored = useStoredCopy();
  const copy = stored.data?.copy;
  const usableOfType = (type: string) => copy?.items.filter((i) => i.type === type && (i.status === 'ready' || i.status === 'out')) ?? [];
  return {
    asset: copy ? (copy.items.find((i) => i.id === assetId) ?? null) : undefined,
    settings: copy?.checkRules,
    probes: usableOfType('probe'),
    bars: usableOfType('scale_bar'),
    pending: stored.isPending,
  };
}

/** Record a field check on one item: /checks/new?assetId=…&kind=… (and &correct=… to open a refused check again). */
export default function CheckNewRoute() {
  const [params] = useSearchParams();
  const { user } = useSession();
  const online = useOnline();
  const assetId = params.get('assetId') ?? '';
  const server = useServerSources(assetId, online);
  const field = useFieldSources(assetId);
  const { asset, settings, probes, bars, pending, error } = online ? server : field;
  const correctId = params.get('correct');
  const refused = useOutboxRecord(correctId);
  const correcting: CheckCorrection | undefined =
    refused.data?.request.kind === 'check' && refused.data.state === 'refused'
      ? { id: refused.data.id, values: refused.data.draft as CheckFormValues, performedAt: refused.data.request.payload.performedAt ?? refused.data.queuedAt }
      : undefined;

  const header = (
    <PageHeader
      title="Record a check"
      description={
        asset
          ? `${asset.assetTag} · ${assetTypeTitles[asset.type]}. The preview works out the result as you type, the same way the server will.`
          : 'A tip validation, two-face or length check, recorded against one item.'
      }
    />
  );

  if (!assetId) {
    return (
      <>
        {header}
        <Notice tone="info" title="Start from the item">
          Open the tip or tracker first — find it by its label — and choose “Record a check” there.
        </Notice>
        <Link to="/scan" className={`${buttonClasses('primary')} mt-4`}>
          Find an item by its label
        </Link>
      </>
    );
  }
  if (pending || (correctId && refused.isPending)) {
    return (
      <>
        {header}
        <LoadingPanel label="Loading the item…" />
      </>
    );
  }
  if (error || !asset || !settings) {
    return (
      <>
        {header}
        <Notice tone="error" title="The item could not be loaded">
          {error ?? 'Without signal, checks can be recorded only for the kit you carry (the copy on this phone).'}
        </Notice>
      </>
    );
  }
  return (
    <>
      <Link to={`/fleet/${asset.id}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        {asset.assetTag}
      </Link>
      {header}
      {online ? null : (
        <div className="mb-3">
          <CopyAge />
        </div>
      )}
      {correcting ? (
        <Notice tone="caution" title="Correcting a refused check" className="mb-3">
          {refused.data?.refusal?.message} Change what is wrong and save it again.
        </Notice>
      ) : null}
      {asset.status === 'retired' ? (
        <Notice tone="info" title="Retired">
          {asset.assetTag} has left the fleet; checks can no longer be recorded for it.
        </Notice>
      ) : (
        <RecordCheckForm
          key={correcting?.id ?? 'new'}
          asset={asset}
          settings={settings}
          probes={probes}
          scaleBars={bars}
          initialKind={params.get('kind')}
          userId={user.id}
          correcting={correcting}
        />
      )}
    </>
  );
}
