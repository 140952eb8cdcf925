import { Link, useParams, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon, DownloadIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { assetRecordPdfUrl, useAssetRecord } from '../../features/fleet/api/get-asset-record';
import { EquipmentRecordSections } from '../../features/fleet/components/equipment-record-sections';
import { EquipmentRecordTable } from '../../features/fleet/components/equipment-record-table';
import { RecordPeriodPicker } from '../../features/fleet/components/record-period-picker';
import { formatCalendarDate, useFirmFormat } from '../../lib/format';

export default function AssetRecordRoute() {
  const { id = '' } = useParams();
  // The period lives in the address (?from=&to=), so a chosen period survives a reload and can be shared.
  const [params, setParams] = useSearchParams();
  const isDay = (v: string | null) => (v && /^\d{4}-\d{2}-\d{2}$/.test(v) ? v : undefined);
  const chosen = { from: isDay(params.get('from')), to: isDay(params.get('to')) };
  const backwards = !!chosen.from && !!chosen.to && chosen.to < chosen.from;
  const period = backwards ? {} : { ...(chosen.from ? { from: chosen.from } : {}), ...(chosen.to ? { to: chosen.to } : {}) };
  const choose = (next: { from?: string; to?: string }) =>
    setParams({ ...(next.from ? { from: next.from } : {}), ...(next.to ? { to: next.to } : {}) }, { replace: true });
  const record = useAssetRecord(id, period);
  const { dateTime } = useFirmFormat();
  const picker = <RecordPeriodPicker period={chosen} onChange={choose} />;

  if (record.isPending) return <LoadingPanel label="Putting the record together…" />;
  if (record.isError) {
    return (
      <>
        <PageHeader title="Equipment record" />
        {picker}
        <Notice tone="error" title="The record could not be loaded">
          {record.error.message}
        </Notice>
      </>
    );
  }
  const { asset, organization, items, generatedAt, recordDate, contentHash } = record.data;
  return (
    <>
      <Link to={`/fleet/${asset.id}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        {asset.assetTag}
      </Link>
      <PageHeader
        title={`Equipment record · ${asset.assetTag}`}
        description={
          <>
            What {organization.name} holds on this item, item by item as ISO/IEC 17025:2017 §6.4.13 asks. Put together {dateTime(generatedAt)}.
          </>
        }
        actions={
          <a href={assetRecordPdfUrl(asset.id, period)} className={buttonClasses('primary')} target="_blank" rel="noopener">
            <DownloadIcon size={16} />
            Download PDF
          </a>
        }
      />
      {picker}
      <p className="mb-3 text-sm text-ink-700">
        Record of {formatCalendarDate(recordDate)}. Content SHA-256 <span className="break-all font-mono">{contentHash}</span>: a reprint of the same content
        shows the same hash. The PDF prints it on every page and annexes each readable certificate.
      </p>
      <div className="flex flex-col gap-4">
        <EquipmentRecordTable items={items} />
        <EquipmentRecordSections record={record.data} />
      </div>
    </>
  );
}
