import type { ColDef, GetRowIdParams, GridApi, GridReadyEvent, RowClickedEvent } from 'ag-grid-community';
import { AgGridReact } from 'ag-grid-react';
import { useCallback, useId, useMemo, useRef, useState, type ReactNode } from 'react';
import { Button } from './button';
import { actionsColumnType, columnTypes, csvExportParams, escapeHtml, nestkeeperGridTheme } from './grid-setup';
import { DownloadIcon } from './icons';

export { actionsColumnType, nestkeeperGridTheme } from './grid-setup';

export interface DataGridProps<T> {
  /** Rows to show; `undefined` while loading. */
  rows: T[] | undefined;
  columns: ColDef<T>[];
  /** Accessible name of the table region, also the toolbar heading for screen readers. */
  label: string;
  /** Stable id of a row (keeps selection and focus across refetches). */
  rowId?: (row: T) => string;
  /** When given, an "Export CSV" button downloads the visible rows with this file name. */
  exportFileName?: string;
  /** Show a "Filter rows" box that filters across all columns. Default true. */
  quickFilter?: boolean;
  loading?: boolean;
  /** Shown inside the grid when there are no rows. */
  emptyMessage?: string;
  /** `'auto'` grows with the rows (small tables); a number fixes the height in px (big tables scroll). */
  height?: number | 'auto';
  onRowClicked?: (row: T) => void;
  /** Extra toolbar content (right side). */
  toolbar?: ReactNode;
  className?: string;
}

/** The one ag-grid wrapper: sort, filter, export; a feature supplies column definitions only. */
export function DataGrid<T>({
  rows,
  columns,
  label,
  rowId,
  exportFileName,
  quickFilter = true,
  loading = false,
  emptyMessage = 'Nothing to show yet.',
  height = 'auto',
  onRowClicked,
  toolbar,
  className = '',
}: DataGridProps<T>) {
  const apiRef = useRef<GridApi<T> | null>(null);
  const [filterText, setFilterText] = useState('');
  const filterId = useId();

  const defaultColDef = useMemo<ColDef<T>>(() => ({ sortable: true, filter: true, resizable: true, flex: 1, minWidth: 120 }), []);

  const getRowId = useMemo(() => (rowId ? (params: GetRowIdParams<T>) => rowId(params.data) : undefined), [rowId]);

  const onGridReady = useCallback((event: GridReadyEvent<T>) => {
    apiRef.current = event.api;
  }, []);

  const exportCsv = useCallback(() => {
    const api = apiRef.current;
    if (!api || !exportFileName) return;
    const columnKeys = api.getAllDisplayedColumns().filter((column) => {
      const type = column.getColDef().type;
      return !(type === actionsColumnType || (Array.isArray(type) && type.includes(actionsColumnType)));
    });
    api.exportDataAsCsv({ fileName: exportFileName, columnKeys });
  }, [exportFileName]);

  const handleRowClicked = useCallback(
    (event: RowClickedEvent<T>) => {
      if (onRowClicked && event.data) onRowClicked(event.data);
    },
    [onRowClicked],
  );

  const showToolbar = quickFilter || exportFileName || toolbar;

  return (
    <section aria-label={label} className={`flex flex-col gap-2 ${className}`}>
      {showToolbar ? (
        <div className="flex flex-wrap items-end gap-2">
          {quickFilter ? (
            <div className="flex min-w-48 flex-1 flex-col gap-1 sm:max-w-72">
              <label htmlFor={filterId} className="text-sm font-semibold text-ink-800">
                Filter rows
              </label>
              <input
                id={filterId}
                type="search"
                value={filterText}
                onChange={(e) => setFilterText(e.target.value)}
                className="min-h-9 rounded-md border border-paper-line bg-card px-3 text-base"
              />
            </div>
          ) : null}
          <div className="ml-auto flex flex-wrap gap-2">
            {toolbar}
            {exportFileName ? (
              <Button size="sm" icon={<DownloadIcon size={14} />} onClick={exportCsv} disabled={!rows?.length}>
                Export CSV
              </Button>
            ) : null}
          </div>
        </div>
      ) : null}
      <div className="nk-grid relative" style={height === 'auto' ? undefined : { height }}>
        <AgGridReact<T>
          theme={nestkeeperGridTheme}
          rowData={rows}
          columnDefs={columns}
          defaultColDef={defaultColDef}
          columnTypes={columnTypes}
          defaultCsvExportParams={csvExportParams}
          getRowId={getRowId}
          quickFilterText={quickFilter ? filterText : undefined}
          loading={loading || rows === undefined}
          overlayNoRowsTemplate={`<span class="nk-grid-empty">${escapeHtml(emptyMessage)}</span>`}
          domLayout={height === 'auto' ? 'autoHeight' : 'normal'}
          onGridReady={onGridReady}
          onRowClicked={onRowClicked ? handleRowClicked : undefined}
          enableCellTextSelection
          suppressDragLeaveHidesColumns
        />
      </div>
    </section>
  );
}
