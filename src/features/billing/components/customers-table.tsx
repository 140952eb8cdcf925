import type { ColDef } from 'ag-grid-community';
import { useMemo } from 'react';
import { DataGrid } from '../../../components/data-grid';
import type { Customer } from '../api/types';

export function CustomersTable({ customers, onOpen }: { customers: Customer[] | undefined; onOpen?: (customer: Customer) => void }) {
  const columns = useMemo<ColDef<Customer>[]>(
    () => [
      { headerName: 'Company', field: 'company', minWidth: 180, flex: 2, cellClass: 'font-semibold', sort: 'asc' },
      { headerName: 'Billing e-mail', field: 'billingEmail', minWidth: 200, flex: 2, cellClass: 'font-mono text-sm' },
      { headerName: 'Contact', field: 'billingContact', minWidth: 140 },
      { headerName: 'Tax number', field: 'taxNumber', minWidth: 130, cellClass: 'font-mono text-sm' },
      { headerName: 'Address', field: 'address', minWidth: 200, flex: 2 },
    ],
    [],
  );
  return (
    <DataGrid<Customer>
      label="Customers"
      rows={customers}
      columns={columns}
      rowId={(c) => c.id}
      exportFileName="nestkeeper-customers.csv"
      emptyMessage="No customers yet."
      onRowClicked={onOpen}
    />
  );
}
