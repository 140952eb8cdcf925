import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { AlertIcon, ArrowLeftIcon, PlusIcon, PrintIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { Panel } from '../../components/panel';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { AssetBookings } from '../../features/bookings/components/asset-bookings';
import { AssetImpactPanel, CalibrationHistory } from '../../features/calibration/components/asset-calibration-panels';
import { AssetChecks } from '../../features/checks/components/asset-checks';
import { checkKindsFor } from '../../features/checks/components/check-words';
import { useFieldItem } from '../../features/field/api/get-field-copy';
import { CopyAge } from '../../features/field/components/copy-age';
import { FieldTipValidations } from '../../features/field/components/field-kit';
import { useAsset } from '../../features/fleet/api/get-asset';
import { assetLabelUrl } from '../../features/fleet/api/get-asset-label';
import { AssetCalibration, AssetIdentity, AssetSpecs } from '../../features/fleet/components/asset-facts';
import { AssetHistory } from '../../features/fleet/components/asset-history';
import { RetireDialog } from '../../features/fleet/components/retire-dialog';
import { HoldPanel } from '../../features/holds/components/hold-panel';
import { PutOnHoldButton } from '../../features/holds/components/put-on-hold';
import { IncidentList } from '../../features/incidents/components/incident-list';
import { kitsKeys } from '../../features/kits/api/keys';
import { assetTypeTitles } from '../../lib/assets';
import { todayIn } from '../../lib/bookings';
import { useOnline } from '../../lib/field/use-field-state';
import { can } from '../../lib/roles';

/** An item's page: from the server with signal, from this phone's field copy without. */
export default function AssetRoute() {
  const { id = '' } = useParams();
  return useOnline() ? <ServerAsset id={id} /> : <FieldAsset id={id} />;
}

/** Without signal: the item as the phone's copy of the kit carried has it, with the field actions. */
function FieldAsset({ id }: { id: string }) {
  const { user } = useSession();
  const field = useFieldItem(id);
  if (field.isPending) return <LoadingPanel label="Loading the asset…" />;
  const a = field.item;
  const copy = field.data?.copy;
  if (!a || !copy)
    return (
      <>
        <PageHeader title="Not on this phone" />
        <CopyAge />
        <Notice tone="info" title="No signal" className="mt-3">
          Without signal this phone shows only the kit you carry. Find signal to open other items.
        </Notice>
      </>
    );
  const live = a.status !== 'retired';
  const big = 'min-h-12 shrink-0 text-lg sm:min-h-10 sm:text-base';
  return (
    <>
      <PageHeader title={a.assetTag} description={[assetTypeTitles[a.type], a.manufacturer, a.model].filter(Boolean).join(' · ')} />
      <div className="mb-3">
        <CopyAge />
      </div>
      <div role="group" aria-label="Asset actions" className="mb-5 flex flex-wrap gap-2">
        {live && can(user.role, 'checks.record') && checkKindsFor(a.type).length ? (
          <Link to={`/checks/new?assetId=${encodeURIComponent(a.id)}`} className={buttonClasses('primary', 'md', big)}>
            <PlusIcon size={18} />
            Record a check
          </Link>
        ) : null}
        {live && can(user.role, 'incidents.report') ? (
          <Link to={`/incidents/new?assetId=${encodeURIComponent(a.id)}`} className={buttonClasses('danger', 'md', big)}>
            <AlertIcon size={18} />
            Report damage
          </Link>
        ) : null}
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <AssetIdentity asset={a} />
        <div className="flex flex-col gap-4">
          <AssetCalibration asset={a} />
          <AssetSpecs asset={a} />
        </div>
        {a.type === 'tip' ? <FieldTipValidations copy={copy} tip={a} /> : null}
      </div>
    </>
  );
}

function ServerAsset({ id }: { id: string }) {
  const { user, organization } = useSession();
  const navigate = useNavigate();
  const asset = useAsset(id);
  const [retiring, setRetiring] = useState(false);
  const queryClient = useQueryClient();

  if (asset.isPending) return <LoadingPanel label="Loading the asset…" />;
  if (asset.isError)
    return (
      <LoadFailure
        error={asset.error}
        thing="asset"
        notFound="No asset in your fleet has this address. It may have been mistyped."
        back={{ to: '/fleet', label: 'Back to all assets' }}
      />
    );

  const a = asset.data;
  const canWrite = can(user.role, 'fleet.write') && a.status !== 'retired';
  const description = [assetTypeTitles[a.type], a.manufacturer, a.model].filter(Boolean).join(' · ');
  const live = a.status !== 'retired';
  const canCheck = live && can(user.role, 'checks.record') && checkKindsFor(a.type).length > 0;
  const canReport = live && can(user.role, 'incidents.report');
  const canHold = can(user.role, 'holds.release');
  const canCalibrate = live && can(user.role, 'calibration.record');
  const big = 'min-h-12 shrink-0 text-lg sm:min-h-10 sm:text-base';

  return (
    <>
      <Link to="/fleet" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        All assets
      </Link>
      <PageHeader title={a.assetTag} description={description} />
      {a.status === 'retired' ? (
        <Notice tone="info" title="Retired" className="mb-4">
          This item has left the fleet{a.retiredReason ? `: ${a.retiredReason}` : ''}. Its record is kept.
        </Notice>
      ) : null}

      <div aria-label="Asset actions" role="group" className="mb-5 flex flex-wrap gap-2">
        {/* Phones: the field actions sit at the bottom, above the menu bar, under the thumb, sharing its width (none cut off at
            the edge); the rest wrap in the page. */}
        {canCheck || canReport ? (
          <div className="fixed inset-x-0 bottom-14 z-20 flex gap-2 border-t border-paper-line bg-card/95 px-3 py-2 backdrop-blur sm:contents">
            {canCheck ? (
              <Link to={`/checks/new?assetId=${encodeURIComponent(a.id)}`} className={buttonClasses('primary', 'md', `${big} flex-1 sm:flex-none`)}>
                <PlusIcon size={18} />
                Record a check
              </Link>
            ) : null}
            {canReport ? (
              <Link to={`/incidents/new?assetId=${encodeURIComponent(a.id)}`} className={buttonClasses('danger', 'md', `${big} flex-1 sm:flex-none`)}>
                <AlertIcon size={18} />
                Report damage
              </Link>
            ) : null}
          </div>
        ) : null}
        {canCalibrate ? (
          <Link to={`/fleet/${a.id}/calibrate`} className={buttonClasses('secondary', 'md', 'min-h-11 shrink-0 sm:min-h-10')}>
            Record a calibration
          </Link>
        ) : null}
        {canCalibrate && a.calibration.required && a.status !== 'at_lab' ? (
          <Link to={`/calibration/plan/${a.id}`} className={buttonClasses('secondary', 'md', 'min-h-11 shrink-0 sm:min-h-10')}>
            Plan lab trip
          </Link>
        ) : null}
        {canHold && live && a.status !== 'held' ? <PutOnHoldButton asset={a} className="min-h-11 shrink-0 sm:min-h-10" /> : null}
        {canWrite ? (
          <Button variant="primary" className="min-h-11 shrink-0 sm:min-h-10" onClick={() => navigate(`/fleet/${a.id}/edit`)}>
            Edit
          </Button>
        ) : null}
        <a href={assetLabelUrl(a.id)} target="_blank" rel="noopener" className={buttonClasses('secondary', 'md', 'min-h-11 shrink-0 sm:min-h-10')}>
          <PrintIcon size={16} />
          Print label
        </a>
        <Link to={`/fleet/${a.id}/record`} className={buttonClasses('secondary', 'md', 'min-h-11 shrink-0 sm:min-h-10')}>
          Equipment record
        </Link>
        {canWrite ? (
          <Button variant="danger" className="min-h-11 shrink-0 sm:min-h-10" onClick={() => setRetiring(true)}>
            Retire
          </Button>
        ) : null}
      </div>

      <div className="grid gap-4 pb-20 sm:pb-0 lg:grid-cols-2">
        {a.status === 'held' ? <HoldPanel asset={a} canRelease={canHold} className="lg:col-span-2" /> : null}
        <AssetImpactPanel assetId={a.id} assetTag={a.assetTag} className="lg:col-span-2" />
        <AssetIdentity asset={a} />
        <div className="flex flex-col gap-4">
          <AssetCalibration asset={a} />
          <AssetSpecs asset={a} />
        </div>
        <AssetBookings assetId={a.id} today={todayIn(organization.timeZone)} canBook={live && can(user.role, 'bookings.write')} />
        <CalibrationHistory assetId={a.id} />
        <AssetChecks asset={a} />
        <Panel title="Incidents">
          <IncidentList params={{ assetId: a.id, limit: 20, offset: 0 }} showAsset={false} empty="No damage or loss has been reported for this item." />
        </Panel>
        <div className="lg:col-span-2">
          <AssetHistory assetId={a.id} />
        </div>
      </div>

      {canWrite ? (
        <RetireDialog
          asset={a}
          open={retiring}
          onClose={() => setRetiring(false)}
          // A retired member changes its kit's readiness.
          onRetired={() => void queryClient.invalidateQueries({ queryKey: kitsKeys.all })}
        />
      ) : null}
    </>
  );
}
