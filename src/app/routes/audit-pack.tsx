import { todayIn } from '../../../shared/calibration/due-date';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { Panel } from '../../components/panel';
import { useKits } from '../../features/kits/api/get-kits';
import { AuditPackForm } from '../../features/records/components/audit-pack-form';
import { useFirmFormat } from '../../lib/format';

export default function AuditPackRoute() {
  const kits = useKits();
  const { timeZone } = useFirmFormat();
  return (
    <>
      <PageHeader
        title="Audit pack"
        description="Everything an auditor samples for a period in one ZIP: each item's equipment record, every certificate as stored, a summary of out-of-tolerance findings, holds and days past due, and an index with each file's SHA-256."
      />
      <Panel title="What goes in the pack">
        {kits.isPending ? <LoadingPanel label="Loading kits…" /> : <AuditPackForm kits={kits.data?.items ?? []} today={todayIn(timeZone ?? 'UTC')} />}
      </Panel>
    </>
  );
}
