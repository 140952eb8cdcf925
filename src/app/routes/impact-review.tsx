import { Link, useParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useAssetImpact } from '../../features/calibration/api/get-asset-impact';
import { impactScope, ImpactReviewWorkspace } from '../../features/calibration/components/impact-review-workspace';
import { isApiError } from '../../lib/api-client';
import { can } from '../../lib/roles';

/** The out-of-tolerance impact review of one item: /calibration/impact/:assetId */
export default function ImpactReviewRoute() {
  const { assetId = '' } = useParams();
  const { user } = useSession();
  const impact = useAssetImpact(assetId);

  // A cached "none" may be stale right after a calibration opened a review: wait for the fresh answer.
  if (impact.isPending || (impact.isFetching && impact.data?.state === 'none')) return <LoadingPanel label="Loading the impact review…" />;
  if (impact.isError) {
    const notFound = isApiError(impact.error) && impact.error.status === 404;
    return (
      <>
        <PageHeader title={notFound ? 'Asset not found' : 'The impact review could not be loaded'} />
        <Notice tone="error">{notFound ? 'No asset in your fleet has this address.' : impact.error.message}</Notice>
      </>
    );
  }
  const back = (
    <Link to={`/fleet/${assetId}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
      <ArrowLeftIcon size={14} />
      Back to the item
    </Link>
  );
  if (impact.data.state === 'none') {
    return (
      <>
        {back}
        <PageHeader title="Impact review" />
        <Notice tone="info" title="No impact review">
          This item has never been found out of tolerance, so there is nothing to re-assess.
        </Notice>
      </>
    );
  }
  const review = impact.data;
  const tag = review.asset?.assetTag ?? 'this item';
  return (
    <>
      {back}
      <PageHeader title={`Impact review: ${tag}`} description={impactScope(review, tag)} />
      <p className="mb-4 text-sm text-ink-700">
        Re-assess results given with equipment later found unfit (ISO 9001:2015 §7.1.5.2) and handle the work as nonconforming where needed (ISO/IEC 17025:2017
        §7.10).
      </p>
      {!can(user.role, 'impact.review') ? (
        <Notice tone="info" className="mb-4">
          The owner assesses each booking and tells the customers; you can follow progress here.
        </Notice>
      ) : null}
      <ImpactReviewWorkspace review={review} tag={tag} canAssess={can(user.role, 'impact.review')} />
    </>
  );
}
