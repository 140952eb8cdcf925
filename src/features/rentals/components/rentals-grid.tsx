import type { ColDef, ICellRendererParams } from 'ag-grid-community';
import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { DataGrid } from '../../../components/data-grid';
import { formatMoney, isoTimestamp, useFirmFormat } from '../../../lib/format';
import type { RentalSummary } from '../../../../shared/billing/views';
import { DepositStateChip, depositStateWord, AuthorizationLapse } from '../../../components/deposit-state';
import { RentalStateChip, rentalStateWord } from './rental-words';

type Cell = ICellRendererParams<RentalSummary>;

/** Rentals as a table: sort, filter, export; the number (or a click on the row) opens one. */
export function RentalsGrid({
  rows,
  label,
  emptyMessage,
  exportFileName,
}: {
  rows: RentalSummary[] | undefined;
  label: string;
  emptyMessage: string;
  exportFileName: string;
}) {
  const navigate = useNavigate();
  const { dateTime, dateRange } = useFirmFormat();
  // Fits 1280 px beside the navigation: long words wrap onto a second line instead of pushing the deposit off screen.
  const wrap = {
    wrapText: true,
    autoHeight: true,
    wrapHeaderText: true,
    autoHeaderHeight: true,
    cellStyle: { lineHeight: '1.35', paddingTop: '9px', paddingBottom: '9px' },
  } as const;
  const columns = useMemo<ColDef<RentalSummary>[]>(
    () => [
      {
        headerName: 'Number',
        field: 'number',
        minWidth: 92,
        maxWidth: 130,
        cellClass: 'font-mono font-semibold',
        cellRenderer: (p: Cell) =>
          p.data ? (
            <Link to={`/rentals/${p.data.id}`} className="text-ink-900 underline-offset-2 hover:underline">
              {p.data.number}
            </Link>
          ) : null,
      },
      { headerName: 'Customer', field: 'customerCompany', minWidth: 120, flex: 2, ...wrap },
      {
        colId: 'what',
        headerName: 'Kit or items',
        minWidth: 96,
        ...wrap,
        valueGetter: (p) => (p.data ? (p.data.kitName ?? `${p.data.itemCount} ${p.data.itemCount === 1 ? 'item' : 'items'}`) : ''),
      },
      {
        headerName: 'Dates',
        field: 'startsOn',
        minWidth: 138,
        ...wrap,
        valueFormatter: (p) => (p.data ? dateRange(p.data.startsOn, p.data.endsOn) : ''),
        sort: 'asc',
      },
      {
        colId: 'state',
        headerName: 'State',
        minWidth: 180,
        ...wrap,
        valueGetter: (p) => (p.data ? rentalStateWord(p.data.state) : ''),
        cellRenderer: (p: Cell) => (p.data ? <RentalStateChip state={p.data.state} /> : null),
      },
      {
        headerName: 'Total',
        field: 'totalMinor',
        type: 'numericColumn',
        minWidth: 96,
        valueFormatter: (p) => (p.data ? formatMoney(p.data.totalMinor, p.data.currency) : ''),
      },
      {
        colId: 'deposit',
        headerName: 'Deposit',
        // The state chip and the amount wrap onto two lines rather than being cut off.
        minWidth: 140,
        flex: 1,
        ...wrap,
        valueGetter: (p) => (p.data ? `${depositStateWord(p.data.depositState)} ${formatMoney(p.data.depositMinor, p.data.currency)}` : ''),
        cellRenderer: (p: Cell) =>
          p.data ? (
            <span className="inline-flex flex-wrap items-center gap-x-2 gap-y-1 py-1 leading-tight">
              <DepositStateChip state={p.data.depositState} />
              <span className="tabular-nums">{formatMoney(p.data.depositMinor, p.data.currency)}</span>
            </span>
          ) : null,
      },
      {
        colId: 'lapses',
        headerName: 'Authorization lapses at',
        minWidth: 150,
        ...wrap,
        valueGetter: (p) => (p.data?.depositState === 'authorized' && p.data.authorizationCaptureBefore ? isoTimestamp(p.data.authorizationCaptureBefore) : ''),
        cellRenderer: (p: Cell) => (p.value ? <AuthorizationLapse at={p.value as string} dateTime={dateTime} /> : '—'),
      },
    ],
    [dateTime, dateRange],
  );
  return (
    <DataGrid<RentalSummary>
      label={label}
      rows={rows}
      columns={columns}
      rowId={(r) => r.id}
      exportFileName={exportFileName}
      emptyMessage={emptyMessage}
      onRowClicked={(r) => navigate(`/rentals/${r.id}`)}
    />
  );
}
