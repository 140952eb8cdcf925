import { Navigate, useNavigate, useParams } from 'react-router-dom';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { useLookupAsset } from '../../features/fleet/api/lookup-asset';
import { FindByLabel, suggestionsIn } from '../../features/fleet/components/find-by-label';
import { isApiError } from '../../lib/api-client';

/** /scan, and /scan/:code (what a label's QR code can point at): look the code up and open the asset. */
export default function ScanRoute() {
  const { code } = useParams();
  const navigate = useNavigate();
  const lookup = useLookupAsset(code);

  if (code && lookup.isPending) return <LoadingPanel label={`Looking up ${code}…`} />;
  if (code && lookup.data) return <Navigate to={`/fleet/${lookup.data.id}`} replace />;

  const problem =
    code && lookup.isError
      ? isApiError(lookup.error) && lookup.error.status === 404
        ? `Nothing in your fleet matches “${code}”.`
        : lookup.error.message
      : undefined;

  return (
    <>
      <PageHeader title="Find by label" description="Type the tag printed on the item, or read its QR label with the camera." />
      <FindByLabel
        key={code ?? ''}
        initialCode={code ?? ''}
        initialProblem={problem}
        initialSuggestions={code && lookup.isError ? suggestionsIn(lookup.error) : []}
        onFound={(asset) => navigate(`/fleet/${asset.id}`)}
      />
    </>
  );
}
