import type { ColDef } from 'ag-grid-community';
import { useMemo } from 'react';
import { DataGrid } from '../../../components/data-grid';
import { formatCalendarDate } from '../../../lib/format';
import type { SiteJobView } from '../../../../shared/bookings/views';

export function SiteJobsTable({ jobs, onOpen, loading }: { jobs: SiteJobView[] | undefined; onOpen: (job: SiteJobView) => void; loading?: boolean }) {
  const columns = useMemo<ColDef<SiteJobView>[]>(
    () => [
      { headerName: 'Reference', field: 'reference', minWidth: 120, maxWidth: 160, cellClass: 'font-mono font-semibold' },
      { headerName: 'Customer', field: 'customerName', minWidth: 180, flex: 2 },
      { headerName: 'Site', field: 'siteAddress', minWidth: 180, flex: 2 },
      {
        headerName: 'From',
        field: 'startsOn',
        minWidth: 120,
        maxWidth: 150,
        valueFormatter: (p) => formatCalendarDate(p.value as string),
      },
      {
        headerName: 'To',
        field: 'endsOn',
        minWidth: 120,
        maxWidth: 150,
        valueFormatter: (p) => formatCalendarDate(p.value as string),
      },
      { headerName: 'Contact', field: 'contactName', minWidth: 140 },
      { headerName: 'E-mail', field: 'contactEmail', minWidth: 180, cellClass: 'font-mono text-sm' },
    ],
    [],
  );
  return (
    <DataGrid<SiteJobView>
      label="Jobs"
      rows={jobs}
      loading={loading}
      columns={columns}
      rowId={(j) => j.id}
      exportFileName="nestkeeper-jobs.csv"
      emptyMessage="No jobs yet."
      onRowClicked={onOpen}
    />
  );
}
