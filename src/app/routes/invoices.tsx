import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { DownloadIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { invoicesCsvUrl, useInvoices } from '../../features/billing/api/get-invoices';
import type { InvoiceKind } from '../../features/billing/api/keys';
import { InvoicesGrid } from '../../features/billing/components/invoices-grid';

const kinds: { value: InvoiceKind | 'all'; label: string }[] = [
  { value: 'all', label: 'Invoices and credit notes' },
  { value: 'invoice', label: 'Invoices only' },
  { value: 'credit_note', label: 'Credit notes only' },
];

/** Every invoice and credit note the firm issued, with the full export for the accountant. */
export default function InvoicesRoute() {
  const [params, setParams] = useSearchParams();
  const kind = kinds.find((k) => k.value === params.get('kind')) ?? kinds[0];
  const invoices = useInvoices(kind.value);
  return (
    <>
      <PageHeader
        title="Invoices"
        description="Issued invoices and credit notes with what the deposits paid and what is still due. Invoices are issued from their rental."
        actions={
          <>
            <a href={invoicesCsvUrl()} className={buttonClasses('secondary')} download>
              <DownloadIcon size={16} />
              Download all (CSV)
            </a>
            <Link to="/billing/reports" className={buttonClasses('secondary')}>
              Revenue and use
            </Link>
            <Link to="/customers" className={buttonClasses('secondary')}>
              Customers and rates
            </Link>
          </>
        }
      />
      <div className="mb-3 flex flex-col gap-1 sm:max-w-xs">
        <label htmlFor="invoice-kind-filter" className="text-sm font-semibold text-ink-800">
          Show
        </label>
        <select
          id="invoice-kind-filter"
          value={kind.value}
          onChange={(e) => setParams(e.target.value === 'all' ? {} : { kind: e.target.value }, { replace: true })}
          className="min-h-10 rounded-md border border-paper-line bg-card px-3"
        >
          {kinds.map((k) => (
            <option key={k.value} value={k.value}>
              {k.label}
            </option>
          ))}
        </select>
      </div>
      {invoices.isError ? <Notice tone="error">{invoices.error.message}</Notice> : null}
      <InvoicesGrid rows={invoices.data?.items} />
      {invoices.data && invoices.data.total > invoices.data.items.length ? (
        <p className="mt-2 text-sm text-ink-700">
          Showing the latest {invoices.data.items.length} of {invoices.data.total}; the CSV download has them all.
        </p>
      ) : null}
    </>
  );
}
