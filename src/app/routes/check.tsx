import { Link, useParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { useCheck } from '../../features/checks/api/get-check';
import { CheckResult } from '../../features/checks/components/check-result';
import { checkKindWords } from '../../features/checks/components/check-words';
import { useAsset } from '../../features/fleet/api/get-asset';
import { useFirmFormat } from '../../lib/format';

/** One stored field check, with the server's numbers. */
export default function CheckRoute() {
  const { id = '' } = useParams();
  const check = useCheck(id);
  const asset = useAsset(check.data?.assetId ?? '');
  const { dateTime } = useFirmFormat();
  if (check.isPending) return <LoadingPanel label="Loading the check…" />;
  if (check.isError) return <LoadFailure error={check.error} thing="check" notFound="No field check in your firm has this address." />;
  const c = check.data;
  const tag = asset.data?.assetTag;
  return (
    <>
      <Link to={`/fleet/${c.assetId}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        {tag ?? 'The item'}
      </Link>
      <PageHeader title={`${checkKindWords[c.kind]}${tag ? ` · ${tag}` : ''}`} description={`Performed ${dateTime(c.performedAt)}.`} />
      <div className="max-w-3xl rounded-lg border border-paper-line bg-card p-4">
        <CheckResult check={c} assetTag={tag} heldNotice={false} />
      </div>
    </>
  );
}
