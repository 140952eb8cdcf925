import { Navigate, useNavigate, useParams } from 'react-router-dom';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { useLookupAsset } from '../../features/fleet/api/lookup-asset';
import { FindByLabel, suggestionsIn } from '../../features/fleet/components/find-by-label';
import { ApiError, isApiError } from '../../lib/api-client';
import { findInCopy, useStoredCopy } from '../../features/field/api/get-field-copy';
import { CopyAge } from '../../features/field/components/copy-age';
import { useOnline } from '../../lib/field/use-field-state';

/** /scan, and /scan/:code (what a label's QR code can point at): look the code up and open the asset. */
export default function ScanRoute() {
  return useOnline() ? <ServerScan /> : <FieldScan />;
}

/** Without signal: the same search over the kit this phone carries a copy of. */
function FieldScan() {
  const { code } = useParams();
  const navigate = useNavigate();
  const stored = useStoredCopy();
  if (stored.isPending) return <LoadingPanel label="Opening the kit on this phone…" />;
  const notHere = (wanted: string) => `“${wanted}” is not in the kit you carry, and without signal this phone knows only that kit.`;
  const found = code ? findInCopy(stored.data, code) : null;
  if (found) return <Navigate to={`/fleet/${found.id}`} replace />;
  return (
    <>
      <PageHeader title="Find by label" description="Type the tag printed on the item, or read its QR label with the camera." />
      <div className="mb-3">
        <CopyAge />
      </div>
      <FindByLabel
        key={code ?? ''}
        initialCode={code ?? ''}
        initialProblem={code ? notHere(code) : undefined}
        onFound={(asset) => navigate(`/fleet/${asset.id}`)}
        lookup={async (wanted) => {
          const asset = findInCopy(stored.data, wanted);
          if (!asset) throw new ApiError({ status: 404, code: 'not_on_phone', message: notHere(wanted) });
          return asset;
        }}
      />
    </>
  );
}

function ServerScan() {
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
