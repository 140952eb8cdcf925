import { formatDateRange } from '../../../lib/format';
import type { ColDef } from 'ag-grid-community';
import type { CustomCellRendererProps } from 'ag-grid-react';
import { useMemo } from 'react';
import { DataGrid } from '../../../components/data-grid';
import { bookingDays } from '../../../lib/bookings';
import type { BookingView } from '../../../../shared/bookings/views';
import { BookingStateChip, bookingContents, bookingStateWords, bookingTitle } from './booking-words';

/** The board's bookings as a table (sort, filter, CSV). */
export function BookingsList({
  bookings,
  onOpen,
  loading,
}: {
  bookings: BookingView[] | undefined;
  onOpen: (booking: BookingView) => void;
  loading?: boolean;
}) {
  const columns = useMemo<ColDef<BookingView>[]>(
    () => [
      {
        headerName: 'Dates',
        colId: 'dates',
        minWidth: 170,
        // Sorts by the first day; reads and exports as the range.
        valueGetter: (p) => (p.data ? `${p.data.startsOn} – ${p.data.endsOn}` : ''),
        valueFormatter: (p) => (p.data ? formatDateRange(p.data.startsOn, p.data.endsOn) : ''),
        sort: 'asc',
      },
      {
        headerName: 'Days',
        colId: 'days',
        maxWidth: 100,
        minWidth: 80,
        filter: false,
        valueGetter: (p) => (p.data ? bookingDays(p.data.startsOn, p.data.endsOn) : null),
      },
      { headerName: 'Job or purpose', colId: 'job', flex: 2, minWidth: 200, valueGetter: (p) => (p.data ? bookingTitle(p.data) : '') },
      { headerName: 'Kit or items', colId: 'contents', flex: 2, minWidth: 180, valueGetter: (p) => (p.data ? bookingContents(p.data) : '') },
      {
        headerName: 'State',
        colId: 'state',
        minWidth: 130,
        maxWidth: 150,
        valueGetter: (p) => (p.data ? bookingStateWords[p.data.state] : ''),
        cellRenderer: (p: CustomCellRendererProps<BookingView>) => (p.data ? <BookingStateChip state={p.data.state} /> : null),
      },
      { headerName: 'Taken by', colId: 'takenBy', minWidth: 140, valueGetter: (p) => p.data?.takenBy ?? '' },
    ],
    [],
  );
  return (
    <DataGrid<BookingView>
      label="Bookings list"
      rows={bookings}
      loading={loading}
      columns={columns}
      rowId={(b) => b.id}
      exportFileName="nestkeeper-bookings.csv"
      emptyMessage="No bookings in these weeks."
      onRowClicked={onOpen}
    />
  );
}
