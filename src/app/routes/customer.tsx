import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { ArrowLeftIcon, PlusIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { FactList, Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { useCustomer } from '../../features/rentals/api/get-customer';
import { useInvoices } from '../../features/billing/api/get-invoices';
import { useRentals } from '../../features/rentals/api/get-rentals';
import { CustomerDialog } from '../../features/rentals/components/customer-dialog';
import { InvoicesGrid } from '../../features/billing/components/invoices-grid';
import { RentalsGrid } from '../../features/rentals/components/rentals-grid';
import { can } from '../../lib/roles';

/** One customer: where invoices go, and everything rented and invoiced to them. */
export default function CustomerRoute() {
  const { id = '' } = useParams();
  const { user } = useSession();
  const customer = useCustomer(id);
  // Asked for alongside the customer, not after it loads, so the three requests run together.
  const rentals = useRentals('all', id);
  const invoices = useInvoices('all', id);
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState<string>();

  if (customer.isPending) return <LoadingPanel label="Loading the customer…" />;
  if (customer.isError) {
    return (
      <LoadFailure
        error={customer.error}
        thing="customer"
        notFound="No customer of your firm has this address."
        back={{ to: '/customers', label: 'Back to customers and rates' }}
      />
    );
  }

  const c = customer.data;
  return (
    <>
      <Link to="/customers" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        Customers and rates
      </Link>
      <PageHeader
        title={c.company}
        description="Where invoices go, and what the customer rented and was invoiced."
        actions={
          <>
            {can(user.role, 'rentals.write') ? (
              <Link to={`/rentals/new?customerId=${encodeURIComponent(c.id)}`} className={buttonClasses('primary')}>
                <PlusIcon size={16} />
                New rental
              </Link>
            ) : null}
            {can(user.role, 'customers.write') ? <Button onClick={() => setEditing(true)}>Edit customer</Button> : null}
          </>
        }
      />
      {saved ? (
        <Notice tone="success" className="mb-3">
          {saved}
        </Notice>
      ) : null}
      <div className="flex flex-col gap-5">
        <Panel title="Billing details">
          <FactList
            items={[
              { term: 'Billing contact', value: c.billingContact },
              { term: 'Billing e-mail', value: c.billingEmail, mono: true },
              { term: 'Address', value: c.address },
              { term: 'Tax number', value: c.taxNumber, mono: true },
              { term: 'Notes', value: c.notes },
            ]}
          />
        </Panel>
        <Panel title="Rentals">
          {rentals.isError ? (
            <Notice tone="error" className="mb-3">
              {rentals.error.message}
            </Notice>
          ) : null}
          <RentalsGrid
            rows={rentals.data?.items}
            label={`Rentals of ${c.company}`}
            emptyMessage="No rentals for this customer yet."
            exportFileName="nestkeeper-customer-rentals.csv"
          />
        </Panel>
        <Panel title="Invoices and credit notes">
          {invoices.isError ? (
            <Notice tone="error" className="mb-3">
              {invoices.error.message}
            </Notice>
          ) : null}
          <InvoicesGrid rows={invoices.data?.items} />
        </Panel>
      </div>

      <CustomerDialog
        open={editing}
        customer={c}
        onClose={() => setEditing(false)}
        onSaved={(changed) => {
          setSaved(`${changed.company} is saved.`);
          setEditing(false);
        }}
      />
    </>
  );
}
