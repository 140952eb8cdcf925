import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import type { CalibrationEventView } from '../../../shared/calibration/views';
import { CalibrationResult } from '../../features/calibration/components/calibration-result';
import { RecordCalibrationForm } from '../../features/calibration/components/record-calibration-form';
import { useAsset } from '../../features/fleet/api/get-asset';
import { isApiError } from '../../lib/api-client';
import { assetTypeTitles } from '../../lib/assets';
import { todayIn } from '../../lib/calibration';
import { can } from '../../lib/roles';

/** Record a calibration certificate for one item: /fleet/:id/calibrate */
export default function CalibrationRecordRoute() {
  const { id = '' } = useParams();
  const { user, organization } = useSession();
  const asset = useAsset(id);
  const [saved, setSaved] = useState<CalibrationEventView | null>(null);

  if (asset.isPending) return <LoadingPanel label="Loading the item…" />;
  if (asset.isError) {
    const notFound = isApiError(asset.error) && asset.error.status === 404;
    return (
      <>
        <PageHeader title={notFound ? 'Asset not found' : 'The item could not be loaded'} />
        <Notice tone="error">{notFound ? 'No asset in your fleet has this address.' : asset.error.message}</Notice>
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
      <PageHeader
        title="Record a calibration"
        description={`${a.assetTag} · ${assetTypeTitles[a.type]}. The lab’s certificate moves the due date${a.status === 'at_lab' ? ' and brings the item back from the lab' : ''}.`}
      />
      {a.status === 'retired' ? (
        <Notice tone="info" title="Retired">
          {a.assetTag} has left the fleet; calibrations can no longer be recorded for it.
        </Notice>
      ) : saved ? (
        <CalibrationResult event={saved} assetTag={a.assetTag} canDecide={can(user.role, 'impact.review')} onDecided={setSaved} />
      ) : (
        <RecordCalibrationForm
          asset={a}
          today={todayIn(organization.timeZone)}
          onSaved={(event) => {
            setSaved(event);
            window.scrollTo({ top: 0 });
          }}
        />
      )}
    </>
  );
}
