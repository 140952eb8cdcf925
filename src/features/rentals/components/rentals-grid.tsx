import type { ColDef, ICellRendererParams } from 'ag-grid-community';
import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { DataGrid } from '../../../components/data-grid';
import { formatCalendarDate, formatMoney, isoTimestamp, useFirmFormat } from '../../../lib/format';
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
  const { dateTime } = useFirmFormat();
  const columns = useMemo<ColDef<RentalSummary>[]>(
    () => [
      {
        headerName: 'Number',
        field: 'number',
        minWidth: 120,
        maxWidth: 150,
        cellClass: 'font-mono font-semibold',
        cellRenderer: (p: Cell) =>
          p.data ? (
            <Link to={`/rentals/${p.data.id}`} className="text-ink-900 underline-offset-2 hover:underline">
              {p.data.number}
            </Link>
          ) : null,
      },
      { headerName: 'Customer', field: 'customerCompany', minWidth: 170, flex: 2 },
      {
        colId: 'what',
        headerName: 'Kit or items',
        minWidth: 150,
        valueGetter: (p) => (p.data ? (p.data.kitName ?? `${p.data.itemCount} ${p.data.itemCount === 1 ? 'item' : 'items'}`) : ''),
      },
      { headerName: 'From', field: 'startsOn', minWidth: 115, valueFormatter: (p) => formatCalendarDate(p.value as string), sort: 'asc' },
      { headerName: 'To', field: 'endsOn', minWidth: 115, valueFormatter: (p) => formatCalendarDate(p.value as string) },
      {
        colId: 'state',
        headerName: 'State',
        minWidth: 170,
        valueGetter: (p) => (p.data ? rentalStateWord(p.data.state) : ''),
        cellRenderer: (p: Cell) => (p.data ? <RentalStateChip state={p.data.state} /> : null),
      },
      {
        headerName: 'Total',
        field: 'totalMinor',
        type: 'numericColumn',
        minWidth: 110,
        valueFormatter: (p) => (p.data ? formatMoney(p.data.totalMinor, p.data.currency) : ''),
      },
      {
        colId: 'deposit',
        headerName: 'Deposit',
        // The state chip and the amount side by side need this much; narrower they wrap rather than being cut off.
        minWidth: 250,
        wrapText: true,
        autoHeight: true,
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
        minWidth: 230,
        valueGetter: (p) => (p.data?.depositState === 'authorized' && p.data.authorizationCaptureBefore ? isoTimestamp(p.data.authorizationCaptureBefore) : ''),
        cellRenderer: (p: Cell) => (p.value ? <AuthorizationLapse at={p.value as string} dateTime={dateTime} /> : '—'),
      },
    ],
    [dateTime],
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
