import type { ColDef, ICellRendererParams } from 'ag-grid-community';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { AssetStatusChip, assetStatusWords, CalibrationChip, calibrationWords } from '../../../components/asset-status';
import { buttonClasses } from '../../../components/button';
import { actionsColumnType, DataGrid } from '../../../components/data-grid';
import { assetTypeTitles, type AssetStatus, type AssetType } from '../../../lib/assets';
import { formatCalendarDate, formatDateRange } from '../../../lib/format';
import type { DueRow } from '../../../../shared/calibration/views';
import { ChooseForTrip } from './due-selection';

const typeTitle = (type: string) => assetTypeTitles[type as AssetType] ?? type;

/** Threatened bookings as one line of text each (also what the CSV export carries). */
const threatText = (row: DueRow) =>
  row.threatened.map((t) => [t.jobReference ?? 'Booking', t.customerName, formatDateRange(t.startsOn, t.endsOn)].filter(Boolean).join(' · ')).join('; ');

function Threats({ row }: { row: DueRow }) {
  if (!row.threatened.length) return <span className="text-ink-500">None</span>;
  return (
    <ul className="flex flex-col gap-1">
      {row.threatened.map((t) => (
        <li key={t.bookingId}>
          <Link to={`/bookings/${t.bookingId}`} className="font-semibold text-brass-deep underline">
            {t.jobReference ?? 'Booking'}
          </Link>
          {t.customerName ? <span> · {t.customerName}</span> : null}
          <span className="block text-sm text-ink-700">{formatDateRange(t.startsOn, t.endsOn)}</span>
        </li>
      ))}
    </ul>
  );
}

/**
 * Overdue or due-soon items with the bookings each threatens (bookings that run
 * past its due date), and the next step per row.
 */
export function DueGrid({
  rows,
  label,
  exportFileName,
  canPlan,
  emptyMessage,
}: {
  rows: DueRow[];
  label: string;
  exportFileName: string;
  canPlan: boolean;
  emptyMessage: string;
}) {
  const columns = useMemo<ColDef<DueRow>[]>(
    () => [
      ...(canPlan
        ? [
            {
              colId: 'choose',
              headerName: '',
              type: actionsColumnType,
              flex: 0,
              width: 52,
              minWidth: 52,
              // What is at the lab or retired goes on no new trip.
              cellRenderer: (p: ICellRendererParams<DueRow>) =>
                p.data && p.data.status !== 'at_lab' && p.data.status !== 'retired' ? (
                  <ChooseForTrip item={{ id: p.data.id, assetTag: p.data.assetTag }} />
                ) : null,
            } satisfies ColDef<DueRow>,
          ]
        : []),
      {
        colId: 'tag',
        headerName: 'Tag',
        valueGetter: (p) => p.data?.assetTag ?? '',
        cellRenderer: (p: ICellRendererParams<DueRow>) =>
          p.data ? (
            <Link to={`/fleet/${p.data.id}`} className="font-mono font-semibold text-ink-900 underline decoration-brass-deep whitespace-nowrap">
              {p.data.assetTag}
            </Link>
          ) : null,
        minWidth: 100,
        maxWidth: 120,
      },
      { colId: 'type', headerName: 'Type', valueGetter: (p) => (p.data ? typeTitle(p.data.type) : ''), minWidth: 100 },
      {
        colId: 'dueOn',
        headerName: 'Due date',
        valueGetter: (p) => p.data?.dueOn ?? '',
        valueFormatter: (p) => (p.value ? formatCalendarDate(p.value as string) : 'Never calibrated'),
        sort: 'asc',
        minWidth: 120,
      },
      { colId: 'kit', headerName: 'Kit', valueGetter: (p) => p.data?.kitName ?? '', valueFormatter: (p) => (p.value as string) || '—', minWidth: 90 },
      {
        colId: 'provider',
        headerName: 'Provider',
        valueGetter: (p) => p.data?.provider ?? '',
        valueFormatter: (p) => (p.value as string) || '—',
        minWidth: 120,
      },
      {
        colId: 'state',
        headerName: 'Calibration',
        valueGetter: (p) => (p.data ? calibrationWords[p.data.state] : ''),
        cellRenderer: (p: ICellRendererParams<DueRow>) => (p.data ? <CalibrationChip state={p.data.state} dueOn={p.data.dueOn} /> : null),
        minWidth: 115,
      },
      {
        colId: 'status',
        headerName: 'Where',
        valueGetter: (p) => (p.data ? (assetStatusWords[p.data.status as AssetStatus] ?? p.data.status) : ''),
        cellRenderer: (p: ICellRendererParams<DueRow>) => (p.data ? <AssetStatusChip status={p.data.status as AssetStatus} /> : null),
        minWidth: 110,
      },
      {
        colId: 'threatened',
        headerName: 'Bookings it threatens',
        valueGetter: (p) => (p.data ? threatText(p.data) : ''),
        cellRenderer: (p: ICellRendererParams<DueRow>) => (p.data ? <Threats row={p.data} /> : null),
        autoHeight: true,
        wrapText: true,
        // The grid sets line-height to the row height; a list in the cell needs ordinary lines.
        cellStyle: { lineHeight: '1.35', paddingTop: '9px', paddingBottom: '9px' },
        flex: 2,
        minWidth: 190,
      },
      ...(canPlan
        ? [
            {
              colId: 'action',
              headerName: '',
              type: actionsColumnType,
              minWidth: 165,
              maxWidth: 180,
              cellRenderer: (p: ICellRendererParams<DueRow>) =>
                !p.data ? null : p.data.status === 'at_lab' ? (
                  <Link to={`/fleet/${p.data.id}/calibrate`} className={buttonClasses('secondary', 'sm')}>
                    Record certificate
                  </Link>
                ) : (
                  <Link to={`/calibration/plan/${p.data.id}`} className={buttonClasses('primary', 'sm')}>
                    Plan lab trip
                  </Link>
                ),
            } satisfies ColDef<DueRow>,
          ]
        : []),
    ],
    [canPlan],
  );
  return (
    <DataGrid<DueRow>
      label={label}
      rows={rows}
      columns={columns}
      rowId={(r) => r.id}
      exportFileName={exportFileName}
      emptyMessage={emptyMessage}
      quickFilter={rows.length > 6}
    />
  );
}
