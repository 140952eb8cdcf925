import type { CellKeyDownEvent, ColDef, GetRowIdParams, GridApi, GridReadyEvent, IDatasource, IGetRowsParams, RowClickedEvent } from 'ag-grid-community';
import { AgGridReact } from 'ag-grid-react';
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { DropPanel } from './drop-panel';
import { columnTypes, nestkeeperGridTheme } from './grid-setup';
import { Notice } from './notice';

export interface RowsRequest {
  offset: number;
  limit: number;
  /** The grid's one sort column, or null for the server's default order. */
  sort: { colId: string; desc: boolean } | null;
}

export interface RowsPage<T> {
  rows: T[];
  total: number;
}

export interface InfiniteDataGridProps<T> {
  columns: ColDef<T>[];
  /** Accessible name of the table region. */
  label: string;
  /**
   * Fetches one block of rows. A new function (e.g. after the filters changed)
   * starts again from the top; keep it memoized otherwise.
   */
  fetchRows: (request: RowsRequest, signal: AbortSignal) => Promise<RowsPage<T>>;
  rowId: (row: T) => string;
  onRowClicked?: (row: T) => void;
  /** Told the total row count after each block (null while not known). */
  onTotal?: (total: number | null) => void;
  /** Bump to reload the rows in place (e.g. after an import). */
  refreshSignal?: number;
  /** Remembers hidden columns in localStorage under this key and shows a "Columns" menu. */
  columnChooserKey?: string;
  emptyMessage?: string;
  /** Height in px; the grid scrolls inside it. */
  height?: number;
  /** Rows per request. */
  blockSize?: number;
  toolbar?: ReactNode;
}

function readHidden(key: string | undefined): Set<string> {
  if (!key || typeof localStorage === 'undefined') return new Set();
  try {
    const value: unknown = JSON.parse(localStorage.getItem(key) ?? '[]');
    return new Set(Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : []);
  } catch {
    return new Set();
  }
}

const colIdOf = <T,>(col: ColDef<T>) => col.colId ?? (col.field as string | undefined) ?? '';

/**
 * The shared grid for big server-side lists: ag-grid's infinite row model
 * fetches rows a block at a time as the person scrolls, sorting on the server.
 * Filters live outside the grid (the screen's own filter bar) and reach the
 * server through `fetchRows`. Same theme as DataGrid.
 */
export function InfiniteDataGrid<T>({
  columns,
  label,
  fetchRows,
  rowId,
  onRowClicked,
  onTotal,
  refreshSignal = 0,
  columnChooserKey,
  emptyMessage = 'Nothing matches.',
  height = 600,
  blockSize = 100,
  toolbar,
}: InfiniteDataGridProps<T>) {
  const apiRef = useRef<GridApi<T> | null>(null);
  const [hidden, setHidden] = useState(() => readHidden(columnChooserKey));
  const [total, setTotal] = useState<number | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const onTotalRef = useRef(onTotal);
  onTotalRef.current = onTotal;

  // Start hidden columns hidden; later toggles go through the grid API.
  const [initialHidden] = useState(hidden);
  const columnDefs = useMemo(() => columns.map((col) => ({ ...col, initialHide: initialHidden.has(colIdOf(col)) })), [columns, initialHidden]);

  const defaultColDef = useMemo<ColDef<T>>(
    () => ({
      sortable: true,
      sortingOrder: ['asc', 'desc', null],
      resizable: true,
      flex: 1,
      minWidth: 110,
      suppressHeaderMenuButton: true,
    }),
    [],
  );

  const datasource = useMemo<IDatasource>(() => {
    const controllers = new Set<AbortController>();
    return {
      getRows(params: IGetRowsParams) {
        const controller = new AbortController();
        controllers.add(controller);
        const first = params.sortModel[0];
        fetchRows(
          {
            offset: params.startRow,
            limit: params.endRow - params.startRow,
            sort: first ? { colId: first.colId, desc: first.sort === 'desc' } : null,
          },
          controller.signal,
        )
          .then((page) => {
            setFailed(null);
            setTotal(page.total);
            onTotalRef.current?.(page.total);
            params.successCallback(page.rows, page.total);
          })
          .catch((error: unknown) => {
            if (!controller.signal.aborted) {
              setFailed(error instanceof Error ? error.message : 'The rows could not be loaded.');
            }
            params.failCallback();
          })
          .finally(() => controllers.delete(controller));
      },
      destroy() {
        for (const controller of controllers) controller.abort();
      },
    };
  }, [fetchRows]);

  useEffect(() => {
    setTotal(null);
    onTotalRef.current?.(null);
  }, [datasource]);

  useEffect(() => {
    if (refreshSignal) apiRef.current?.refreshInfiniteCache();
  }, [refreshSignal]);

  const getRowId = useCallback((params: GetRowIdParams<T>) => rowId(params.data), [rowId]);

  const onGridReady = useCallback((event: GridReadyEvent<T>) => {
    apiRef.current = event.api;
  }, []);

  const handleRowClicked = useCallback(
    (event: RowClickedEvent<T>) => {
      if (onRowClicked && event.data) onRowClicked(event.data);
    },
    [onRowClicked],
  );

  // Keyboard: Enter on a focused row opens it, like a click.
  const handleKeyDown = useCallback(
    (event: CellKeyDownEvent<T>) => {
      const key = (event.event as KeyboardEvent | undefined)?.key;
      if (key === 'Enter' && onRowClicked && event.data) onRowClicked(event.data);
    },
    [onRowClicked],
  );

  const toggleColumn = (colId: string, visible: boolean) => {
    apiRef.current?.setColumnsVisible([colId], visible);
    setHidden((prev) => {
      const next = new Set(prev);
      if (visible) next.delete(colId);
      else next.add(colId);
      if (columnChooserKey) {
        try {
          localStorage.setItem(columnChooserKey, JSON.stringify([...next]));
        } catch {
          // Storage full or blocked: the choice lasts for this visit only.
        }
      }
      return next;
    });
  };

  return (
    <section aria-label={label} className="flex flex-col gap-2">
      {toolbar || columnChooserKey ? (
        <div className="flex flex-wrap items-center justify-end gap-2">
          {toolbar}
          {columnChooserKey ? (
            <DropPanel summary="Columns" align="right" summaryClassName="min-h-8 px-2.5 text-sm">
              <fieldset className="w-56">
                <legend className="sr-only">Columns to show</legend>
                {columns.map((col) => {
                  const id = colIdOf(col);
                  return (
                    <label key={id} className="flex min-h-9 items-center gap-2 rounded px-1 hover:bg-paper-deep">
                      <input
                        type="checkbox"
                        className="size-4 accent-brass-deep"
                        checked={!hidden.has(id)}
                        disabled={col.lockVisible}
                        onChange={(e) => toggleColumn(id, e.target.checked)}
                      />
                      {col.headerName ?? id}
                    </label>
                  );
                })}
              </fieldset>
            </DropPanel>
          ) : null}
        </div>
      ) : null}
      {failed ? (
        <Notice tone="error" title="Some rows could not be loaded">
          {failed} Scroll or change a filter to try again.
        </Notice>
      ) : null}
      <div className={`nk-grid relative ${onRowClicked ? 'nk-grid-clickable' : ''}`} style={{ height: `min(${height}px, 75dvh)` }}>
        <AgGridReact<T>
          theme={nestkeeperGridTheme}
          rowModelType="infinite"
          datasource={datasource}
          cacheBlockSize={blockSize}
          maxBlocksInCache={60}
          infiniteInitialRowCount={1}
          maxConcurrentDatasourceRequests={2}
          blockLoadDebounceMillis={80}
          columnDefs={columnDefs}
          defaultColDef={defaultColDef}
          columnTypes={columnTypes}
          getRowId={getRowId}
          suppressMultiSort
          onGridReady={onGridReady}
          onRowClicked={onRowClicked ? handleRowClicked : undefined}
          onCellKeyDown={onRowClicked ? handleKeyDown : undefined}
          suppressDragLeaveHidesColumns
        />
        {total === 0 ? <p className="pointer-events-none absolute inset-x-0 top-16 text-center text-ink-700">{emptyMessage}</p> : null}
      </div>
    </section>
  );
}
