import { useQueryClient } from '@tanstack/react-query';
import type { ColDef } from 'ag-grid-community';
import type { CustomCellRendererProps } from 'ag-grid-react';
import { useCallback, useMemo } from 'react';
import { AssetStatusChip, assetStatusWords, CalibrationChip, calibrationWords } from '../../../components/asset-status';
import { InfiniteDataGrid, type RowsRequest } from '../../../components/infinite-data-grid';
import { assetTypeTitles } from '../../../lib/assets';
import { formatCalendarDate } from '../../../lib/format';
import { assetsQueryOptions } from '../api/get-assets';
import type { AssetFilter } from '../api/keys';
import type { AssetView } from '../../../../shared/assets/views';

/** Grid columns that the server can sort by (colId = the API's sort field). */
const serverSortable = new Set(['assetTag', 'type', 'serialNumber', 'manufacturer', 'model', 'location', 'status', 'dueOn']);

export const fleetColumnsStorageKey = 'nk.fleet.columns';

const baseColumns: (ColDef<AssetView> & { colId: string })[] = [
  {
    headerName: 'Asset tag',
    colId: 'assetTag',
    field: 'assetTag',
    lockVisible: true,
    pinned: 'left',
    minWidth: 130,
    cellClass: 'font-mono text-[0.9rem] font-semibold',
  },
  { headerName: 'Type', colId: 'type', valueGetter: (p) => (p.data ? assetTypeTitles[p.data.type] : ''), minWidth: 130 },
  { headerName: 'Serial', colId: 'serialNumber', field: 'serialNumber', cellClass: 'font-mono text-[0.9rem]', minWidth: 130 },
  { headerName: 'Maker', colId: 'manufacturer', field: 'manufacturer', minWidth: 120 },
  { headerName: 'Model', colId: 'model', field: 'model', minWidth: 120 },
  {
    headerName: 'Status',
    colId: 'status',
    minWidth: 120,
    valueGetter: (p) => (p.data ? assetStatusWords[p.data.status] : ''),
    cellRenderer: (p: CustomCellRendererProps<AssetView>) => (p.data ? <AssetStatusChip status={p.data.status} /> : null),
  },
  {
    headerName: 'Calibration',
    colId: 'calibration',
    sortable: false,
    minWidth: 140,
    valueGetter: (p) => (p.data ? calibrationWords[p.data.calibration.state] : ''),
    cellRenderer: (p: CustomCellRendererProps<AssetView>) =>
      p.data ? <CalibrationChip state={p.data.calibration.state} dueOn={p.data.calibration.dueOn} /> : null,
  },
  {
    headerName: 'Due',
    colId: 'dueOn',
    minWidth: 120,
    valueGetter: (p) => p.data?.calibration.dueOn ?? null,
    valueFormatter: (p) => (p.data ? formatCalendarDate(p.value as string | null) : ''),
  },
  { headerName: 'Kit', colId: 'kit', sortable: false, minWidth: 120, valueGetter: (p) => p.data?.kit?.name ?? '—' },
  { headerName: 'Location', colId: 'location', field: 'location', minWidth: 130 },
];
const columns: ColDef<AssetView>[] = baseColumns.map((col) => ({ ...col, sortable: col.sortable ?? serverSortable.has(col.colId) }));

/**
 * The whole fleet in one scrolling table: rows arrive a block at a time from
 * GET /api/assets (through the query cache), sorted by the server.
 */
export function FleetGrid({
  filter,
  onOpen,
  onTotal,
  refreshSignal,
}: {
  filter: AssetFilter;
  onOpen: (asset: AssetView) => void;
  onTotal: (total: number | null) => void;
  refreshSignal?: number;
}) {
  const queryClient = useQueryClient();
  // The filter object changes identity on every render of the route; key on its content.
  const filterKey = JSON.stringify(filter);

  const fetchRows = useCallback(
    async ({ offset, limit, sort }: RowsRequest) => {
      const page = await queryClient.fetchQuery(
        assetsQueryOptions({
          ...(JSON.parse(filterKey) as AssetFilter),
          sort: sort ? `${sort.desc ? '-' : ''}${sort.colId}` : undefined,
          limit,
          offset,
        }),
      );
      return { rows: page.items, total: page.total };
    },
    [queryClient, filterKey],
  );

  const rowId = useCallback((asset: AssetView) => asset.id, []);
  const gridColumns = useMemo(() => columns, []);

  return (
    <InfiniteDataGrid<AssetView>
      label="Fleet register"
      columns={gridColumns}
      fetchRows={fetchRows}
      rowId={rowId}
      onRowClicked={onOpen}
      onTotal={onTotal}
      refreshSignal={refreshSignal}
      columnChooserKey={fleetColumnsStorageKey}
      emptyMessage="No assets match these filters."
      height={640}
    />
  );
}
