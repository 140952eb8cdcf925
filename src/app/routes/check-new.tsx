import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { RecordCheckForm } from '../../features/checks/components/record-check-form';
import { useAsset } from '../../features/fleet/api/get-asset';
import { useAssets } from '../../features/fleet/api/get-assets';
import { useSettings } from '../../features/settings/api/get-settings';
import { assetTypeTitles } from '../../lib/assets';

const usable = { status: ['ready', 'out'] as ('ready' | 'out')[], sort: 'assetTag', limit: 200, offset: 0 };

/** Record a field check on one item: /checks/new?assetId=…&kind=… */
export default function CheckNewRoute() {
  const [params] = useSearchParams();
  const assetId = params.get('assetId') ?? '';
  const asset = useAsset(assetId);
  const settings = useSettings();
  const type = asset.data?.type;
  const probes = useAssets({ ...usable, type: ['probe'] }, { enabled: type === 'tip' });
  const bars = useAssets({ ...usable, type: ['scale_bar'] }, { enabled: type === 'tracker' });

  const header = (
    <PageHeader
      title="Record a check"
      description={
        asset.data
          ? `${asset.data.assetTag} · ${assetTypeTitles[asset.data.type]}. The preview works out the result as you type, the same way the server will.`
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
  if (asset.isPending || settings.isPending) {
    return (
      <>
        {header}
        <LoadingPanel label="Loading the item…" />
      </>
    );
  }
  if (asset.isError || settings.isError) {
    return (
      <>
        {header}
        <Notice tone="error" title="The item could not be loaded">
          {(asset.error ?? settings.error)?.message}
        </Notice>
      </>
    );
  }
  const a = asset.data;
  return (
    <>
      <Link to={`/fleet/${a.id}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        {a.assetTag}
      </Link>
      {header}
      {a.status === 'retired' ? (
        <Notice tone="info" title="Retired">
          {a.assetTag} has left the fleet; checks can no longer be recorded for it.
        </Notice>
      ) : (
        <RecordCheckForm
          asset={a}
          settings={settings.data}
          probes={probes.data?.items ?? []}
          scaleBars={bars.data?.items ?? []}
          initialKind={params.get('kind')}
        />
      )}
    </>
  );
}
