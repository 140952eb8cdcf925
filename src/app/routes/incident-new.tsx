import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useAsset } from '../../features/fleet/api/get-asset';
import { ReportIncidentForm } from '../../features/incidents/components/report-incident-form';

/** Report damage or loss, phone first: /incidents/new?assetId=… */
export default function IncidentNewRoute() {
  const [params] = useSearchParams();
  const assetId = params.get('assetId') ?? '';
  const asset = useAsset(assetId);
  const header = <PageHeader title="Report damage" description="Say what happened; the item is taken out of service at once." />;

  let body;
  if (!assetId) {
    body = (
      <>
        <Notice tone="info" title="Start from the item">
          Find the item by its label, then choose “Report damage” on its page.
        </Notice>
        <Link to="/scan" className={`${buttonClasses('primary', 'md', 'min-h-12 text-lg')} mt-4`}>
          Find an item by its label
        </Link>
      </>
    );
  } else if (asset.isPending) body = <LoadingPanel label="Loading the item…" />;
  else if (asset.isError)
    body = (
      <Notice tone="error" title="The item could not be loaded">
        {asset.error.message}
      </Notice>
    );
  else if (asset.data.status === 'retired')
    body = (
      <Notice tone="info" title="Retired">
        {asset.data.assetTag} has left the fleet.
      </Notice>
    );
  else body = <ReportIncidentForm asset={asset.data} bookingId={params.get('bookingId')} />;

  return (
    <div className="mx-auto max-w-2xl">
      {asset.data ? (
        <Link to={`/fleet/${asset.data.id}`} className="mb-2 inline-flex min-h-11 items-center gap-1 text-base font-semibold text-brass-deep">
          <ArrowLeftIcon size={16} />
          {asset.data.assetTag}
        </Link>
      ) : null}
      {header}
      {body}
    </div>
  );
}
