import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useFieldItem, useOutboxRecord } from '../../features/field/api/get-field-copy';
import { CopyAge } from '../../features/field/components/copy-age';
import { useAsset } from '../../features/fleet/api/get-asset';
import { ReportIncidentForm, type IncidentCorrection, type IncidentFormValues } from '../../features/incidents/components/report-incident-form';
import { useOnline } from '../../lib/field/use-field-state';

/** Report damage or loss, phone first: /incidents/new?assetId=… (and &correct=… to open a refused report again). Works without signal for the kit carried. */
export default function IncidentNewRoute() {
  const [params] = useSearchParams();
  const { user } = useSession();
  const online = useOnline();
  const assetId = params.get('assetId') ?? '';
  const server = useAsset(assetId);
  const field = useFieldItem(assetId);
  const asset = online ? server.data : field.item;
  const pending = online ? server.isPending : field.isPending;
  const problem = online
    ? server.error?.message
    : field.isSuccess && !field.item
      ? 'Without signal, damage can be reported only for the kit you carry (the copy on this phone).'
      : undefined;
  const refused = useOutboxRecord(params.get('correct'));
  const r = refused.data;
  const correcting: IncidentCorrection | undefined =
    r?.request.kind === 'incident' && r.state === 'refused'
      ? { id: r.id, values: r.draft as IncidentFormValues, photos: r.request.photos.map((p) => new File([p.blob], p.name, { type: p.type })) }
      : undefined;
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
  } else if (pending || (params.get('correct') && refused.isPending)) body = <LoadingPanel label="Loading the item…" />;
  else if (problem || !asset)
    body = (
      <Notice tone="error" title="The item could not be loaded">
        {problem}
      </Notice>
    );
  else if (asset.status === 'retired')
    body = (
      <Notice tone="info" title="Retired">
        {asset.assetTag} has left the fleet.
      </Notice>
    );
  else
    body = (
      <>
        {correcting ? (
          <Notice tone="caution" title="Correcting a refused report" className="mb-3">
            {r?.refusal?.message} Change what is wrong and send it again.
          </Notice>
        ) : null}
        <ReportIncidentForm key={correcting?.id ?? 'new'} asset={asset} bookingId={params.get('bookingId')} userId={user.id} correcting={correcting} />
      </>
    );

  return (
    <div className="mx-auto max-w-2xl">
      {asset ? (
        <Link to={`/fleet/${asset.id}`} className="mb-2 inline-flex min-h-11 items-center gap-1 text-base font-semibold text-brass-deep">
          <ArrowLeftIcon size={16} />
          {asset.assetTag}
        </Link>
      ) : null}
      {header}
      {online ? null : (
        <div className="mb-3">
          <CopyAge />
        </div>
      )}
      {body}
    </div>
  );
}
