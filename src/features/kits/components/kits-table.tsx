import type { ColDef } from 'ag-grid-community';
import type { CustomCellRendererProps } from 'ag-grid-react';
import { useMemo } from 'react';
import { DataGrid } from '../../../components/data-grid';
import { formatCount } from '../../../lib/format';
import type { KitView } from '../../../../shared/assets/views';
import { ReadinessChip, readinessReasonText } from './readiness';

export function KitsTable({ kits, onOpen }: { kits: KitView[] | undefined; onOpen: (kit: KitView) => void }) {
  const columns = useMemo<ColDef<KitView>[]>(
    () => [
      { headerName: 'Name', field: 'name', minWidth: 180, cellClass: 'font-semibold' },
      {
        headerName: 'Members',
        field: 'memberCount',
        maxWidth: 130,
        filter: false,
        valueFormatter: (p) => formatCount(p.value as number),
      },
      {
        headerName: 'Readiness',
        colId: 'readiness',
        minWidth: 130,
        maxWidth: 160,
        valueGetter: (p) => (p.data ? (p.data.readiness.ready ? 'Ready' : 'Not ready') : ''),
        cellRenderer: (p: CustomCellRendererProps<KitView>) => (p.data ? <ReadinessChip readiness={p.data.readiness} /> : null),
      },
      {
        headerName: 'Why not ready',
        colId: 'reasons',
        flex: 2,
        minWidth: 220,
        valueGetter: (p) => (p.data ? p.data.readiness.reasons.map(readinessReasonText).join('; ') : ''),
      },
    ],
    [],
  );
  return (
    <DataGrid<KitView>
      label="Kits"
      rows={kits}
      columns={columns}
      rowId={(k) => k.id}
      exportFileName="nestkeeper-kits.csv"
      emptyMessage="No kits yet."
      onRowClicked={onOpen}
    />
  );
}
