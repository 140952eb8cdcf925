import { Link, useNavigate, useParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useAsset } from '../../features/fleet/api/get-asset';
import { AssetForm } from '../../features/fleet/components/asset-form';
import { useSettings } from '../../features/settings/api/get-settings';
import { DEFAULT_DUE_SOON_DAYS } from '../../lib/calibration';

/** /fleet/new and /fleet/:id/edit. */
export default function AssetFormRoute() {
  const { id } = useParams();
  const { organization } = useSession();
  const navigate = useNavigate();
  const settings = useSettings();
  const asset = useAsset(id ?? '');
  const dueSoonDays = settings.data?.dueSoonDays ?? DEFAULT_DUE_SOON_DAYS;
  const timeZone = settings.data?.timeZone ?? organization.timeZone;
  const currency = settings.data?.currency ?? organization.currency;

  if (!id) {
    return (
      <>
        <PageHeader title="Register an asset" description="Add one item to the fleet. The type decides which facts are asked for." />
        <AssetForm
          mode="create"
          timeZone={timeZone}
          currency={currency}
          dueSoonDays={dueSoonDays}
          onSaved={(saved) => navigate(`/fleet/${saved.id}`)}
          onCancel={() => navigate('/fleet')}
        />
      </>
    );
  }

  if (asset.isPending) return <LoadingPanel label="Loading the asset…" />;
  if (asset.isError) {
    return (
      <>
        <PageHeader title="The asset could not be loaded" />
        <Notice tone="error">{asset.error.message}</Notice>
      </>
    );
  }
  if (asset.data.status === 'retired') {
    return (
      <>
        <PageHeader title={`Edit ${asset.data.assetTag}`} />
        <Notice tone="info" title="Retired items cannot be edited">
          The record is kept as it was when the item left the fleet.
        </Notice>
        <Link to={`/fleet/${id}`} className={`${buttonClasses('secondary')} mt-4`}>
          Back to {asset.data.assetTag}
        </Link>
      </>
    );
  }
  return (
    <>
      <PageHeader title={`Edit ${asset.data.assetTag}`} />
      <AssetForm
        key={asset.data.id}
        mode="edit"
        asset={asset.data}
        timeZone={timeZone}
        currency={asset.data.currency || currency}
        dueSoonDays={dueSoonDays}
        onSaved={(saved) => navigate(`/fleet/${saved.id}`)}
        onCancel={() => navigate(`/fleet/${id}`)}
      />
    </>
  );
}
