import type { ColDef, ICellRendererParams, ValueFormatterParams } from 'ag-grid-community';
import { useMemo, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { actionsColumnType, DataGrid } from '../../../components/data-grid';
import { formatCalendarDate, formatMoney } from '../../../lib/format';
import { invoiceDocumentUrl } from '../api/get-invoices';
import type { InvoiceSummary } from '../../../../shared/billing/views';

type Cell = ICellRendererParams<InvoiceSummary>;
const kindWords: Record<InvoiceSummary['kind'], string> = { invoice: 'Invoice', credit_note: 'Credit note' };

/** Invoices and credit notes: sort and filter (the page's one CSV download has every row); the number opens the rental, the PDF link the document. */
export function InvoicesGrid({ rows, toolbar }: { rows: InvoiceSummary[] | undefined; toolbar?: ReactNode }) {
  const columns = useMemo<ColDef<InvoiceSummary>[]>(() => {
    const money = (field: keyof InvoiceSummary & `${string}Minor`, headerName: string): ColDef<InvoiceSummary> => ({
      headerName,
      field,
      type: 'numericColumn',
      minWidth: 96,
      flex: 1,
      wrapHeaderText: true,
      autoHeaderHeight: true,
      valueFormatter: (p: ValueFormatterParams<InvoiceSummary>) => (p.data ? formatMoney(p.value as number, p.data.currency) : ''),
    });
    return [
      {
        headerName: 'Number',
        field: 'number',
        minWidth: 140,
        cellClass: 'font-mono font-semibold',
        cellRenderer: (p: Cell) =>
          p.data ? (
            <Link to={`/rentals/${p.data.rentalId}`} className="text-ink-900 underline-offset-2 hover:underline">
              {p.data.number}
            </Link>
          ) : null,
      },
      {
        colId: 'kind',
        headerName: 'Kind',
        minWidth: 130,
        // "Credit note to 2026-0003" wraps onto two lines rather than pushing the money off screen.
        wrapText: true,
        autoHeight: true,
        cellStyle: { lineHeight: '1.35', paddingTop: '9px', paddingBottom: '9px' },
        valueGetter: (p) => (p.data ? kindWords[p.data.kind] : ''),
        cellRenderer: (p: Cell) =>
          p.data ? (
            <span>
              {kindWords[p.data.kind]}
              {p.data.correctsNumber ? (
                <span className="text-ink-700">
                  {' '}
                  to <span className="font-mono">{p.data.correctsNumber}</span>
                </span>
              ) : null}
            </span>
          ) : null,
      },
      { headerName: 'Issued on', field: 'issuedOn', minWidth: 124, sort: 'desc', valueFormatter: (p) => formatCalendarDate(p.value as string) },
      {
        headerName: 'Customer',
        field: 'customerCompany',
        minWidth: 140,
        flex: 2,
        wrapText: true,
        autoHeight: true,
        cellStyle: { lineHeight: '1.35', paddingTop: '9px', paddingBottom: '9px' },
      },
      money('totalMinor', 'Total'),
      {
        ...money('depositCapturedMinor', 'Paid at return'),
        colId: 'paidAtReturn',
        valueGetter: (p) => (p.data ? p.data.depositCapturedMinor + p.data.cardChargedMinor : 0),
      },
      money('creditedMinor', 'Credited'),
      money('receivedMinor', 'Received'),
      // Balance is what is still owed: after what was paid at return, credit notes and payments received.
      money('outstandingMinor', 'Balance'),
      {
        colId: 'pdf',
        headerName: 'Document',
        type: actionsColumnType,
        minWidth: 96,
        maxWidth: 110,
        cellRenderer: (p: Cell) =>
          p.data ? (
            <a
              href={invoiceDocumentUrl(p.data.id)}
              target="_blank"
              rel="noopener"
              aria-label={`${kindWords[p.data.kind]} ${p.data.number} (PDF)`}
              className="font-semibold text-brass-deep underline"
            >
              PDF
            </a>
          ) : null,
      },
    ];
  }, []);
  return (
    <DataGrid<InvoiceSummary>
      label="Invoices and credit notes"
      rows={rows}
      columns={columns}
      rowId={(r) => r.id}
      emptyMessage="No invoices yet. An invoice is issued from its rental once the kit is back and the deposit is settled."
      toolbar={toolbar}
    />
  );
}
