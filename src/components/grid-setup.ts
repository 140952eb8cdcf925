import {
  CellStyleModule,
  ClientSideRowModelModule,
  ColumnApiModule,
  CsvExportModule,
  InfiniteRowModelModule,
  ModuleRegistry,
  QuickFilterModule,
  RowAutoHeightModule,
  TextFilterModule,
  ValidationModule,
  themeQuartz,
  type ColTypeDef,
  type CsvExportParams,
} from 'ag-grid-community';
import { neutraliseFormula } from '../../shared/csv/formula-guard';

// Only the ag-grid modules Nestkeeper uses (not AllCommunityModule), registered
// once when the first page with a table loads. This module is only imported by
// lazily loaded screens, so ag-grid stays out of the initial bundle.
// ValidationModule explains misconfigurations in development and is dropped from builds.
ModuleRegistry.registerModules([
  ClientSideRowModelModule, // small in-memory tables (DataGrid)
  InfiniteRowModelModule, // big server-paged tables (InfiniteDataGrid)
  QuickFilterModule, // DataGrid's "Filter rows" box
  TextFilterModule, // DataGrid's column filters
  CsvExportModule, // DataGrid's "Export CSV"
  ColumnApiModule, // column chooser (setColumnsVisible)
  CellStyleModule, // cellClass (mono tags and serials)
  RowAutoHeightModule, // rows that grow with a list in a cell (autoHeight columns)
  ...(import.meta.env.DEV ? [ValidationModule] : []),
]);

/** Nestkeeper's grid look: paper rows, ink header, brass focus, bundled fonts only. */
export const nestkeeperGridTheme = themeQuartz.withParams({
  fontFamily: ['Source Sans 3', 'system-ui', 'sans-serif'],
  headerFontFamily: ['Source Sans 3', 'system-ui', 'sans-serif'],
  fontSize: 15,
  headerFontSize: 14,
  headerFontWeight: 600,
  backgroundColor: '#fffdf8',
  foregroundColor: '#1c2536',
  textColor: '#1c2536',
  subtleTextColor: '#5b6474',
  headerBackgroundColor: '#ebe3d3',
  headerTextColor: '#1c2536',
  oddRowBackgroundColor: '#fbf8f1',
  rowHoverColor: '#f1e6c9',
  selectedRowBackgroundColor: '#f1e6c9',
  borderColor: '#d9cfbb',
  accentColor: '#7a5f22',
  chromeBackgroundColor: '#ebe3d3',
  wrapperBorderRadius: 8,
  borderRadius: 4,
  spacing: 6,
  rowHeight: 40,
  headerHeight: 38,
  iconSize: 14,
});

/** Column type for per-row buttons: not sortable, not filterable, left out of CSV. */
export const actionsColumnType = 'nkActions';
export const columnTypes: Record<string, ColTypeDef> = {
  [actionsColumnType]: { sortable: false, filter: false, resizable: false, suppressHeaderMenuButton: true },
};

/**
 * Every grid's CSV export: each cell as ag-grid would write it (the column's
 * formatter unless the column opts out), then through the shared formula guard
 * so a spreadsheet shows user text as text. ag-grid quotes every cell itself.
 */
export const csvExportParams: CsvExportParams = {
  processCellCallback: ({ value, column, formatValue }) => {
    const cell: unknown = column.getColDef().useValueFormatterForExport === false ? value : formatValue(value);
    return String(neutraliseFormula(cell ?? ''));
  },
};

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
