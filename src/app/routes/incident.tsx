import { Link, useParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { BatteryCaution } from '../../components/safety-cautions';
import { useSession } from '../../features/auth/components/session-context';
import { useIncident } from '../../features/incidents/api/get-incident';
import { IncidentFacts, IncidentPhotos } from '../../features/incidents/components/incident-details';
import { incidentKindWords } from '../../features/incidents/components/incident-words';
import { ReviewActions } from '../../features/incidents/components/review-actions';
import { can } from '../../lib/roles';

export default function IncidentRoute() {
  const { id = '' } = useParams();
  const { user, organization } = useSession();
  const incident = useIncident(id);
  if (incident.isPending) return <LoadingPanel label="Loading the report…" />;
  if (incident.isError) return <LoadFailure error={incident.error} thing="incident" notFound="No incident in your firm has this address." />;
  const i = incident.data;
  const tag = i.asset?.assetTag;
  return (
    <>
      <Link to="/incidents" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        All incidents
      </Link>
      <PageHeader
        title={`${incidentKindWords[i.kind]}${tag ? ` · ${tag}` : ''}`}
        actions={can(user.role, 'incidents.review') ? <ReviewActions incident={i} currency={organization.currency} /> : undefined}
      />
      {i.asset?.type === 'battery' && i.kind !== 'missing' ? <BatteryCaution className="mb-4" /> : null}
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <IncidentFacts incident={i} currency={organization.currency} />
        <IncidentPhotos incident={i} />
      </div>
    </>
  );
}
