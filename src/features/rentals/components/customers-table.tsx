import type { ColDef, ICellRendererParams } from 'ag-grid-community';
import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { DataGrid } from '../../../components/data-grid';
import type { CustomerView } from '../../../../shared/billing/views';

/** Customers as a table; the company (or a click on the row) opens the customer's page. */
export function CustomersTable({ customers }: { customers: CustomerView[] | undefined }) {
  const navigate = useNavigate();
  const columns = useMemo<ColDef<CustomerView>[]>(
    () => [
      {
        headerName: 'Company',
        field: 'company',
        minWidth: 180,
        flex: 2,
        cellClass: 'font-semibold',
        sort: 'asc',
        cellRenderer: (p: ICellRendererParams<CustomerView>) =>
          p.data ? (
            <Link to={`/customers/${p.data.id}`} className="text-ink-900 underline-offset-2 hover:underline">
              {p.data.company}
            </Link>
          ) : null,
      },
      { headerName: 'Billing e-mail', field: 'billingEmail', minWidth: 200, flex: 2, cellClass: 'font-mono text-sm' },
      { headerName: 'Contact', field: 'billingContact', minWidth: 140 },
      { headerName: 'Tax number', field: 'taxNumber', minWidth: 130, cellClass: 'font-mono text-sm' },
      { headerName: 'Address', field: 'address', minWidth: 200, flex: 2 },
    ],
    [],
  );
  return (
    <DataGrid<CustomerView>
      label="Customers"
      rows={customers}
      columns={columns}
      rowId={(c) => c.id}
      exportFileName="nestkeeper-customers.csv"
      emptyMessage="No customers yet."
      onRowClicked={(c) => navigate(`/customers/${c.id}`)}
    />
  );
}
