import type { ColDef, ICellRendererParams } from 'ag-grid-community';
import { useMemo } from 'react';
import { useNavigate } from 'react-router-dom';
import { DataGrid } from '../../../components/data-grid';
import { assetTypeTitles } from '../../../lib/assets';
import { isoTimestamp, useFirmFormat } from '../../../lib/format';
import type { IncidentView } from '../../../../shared/incidents/views';
import { IncidentStateChip, incidentKindWords, incidentStateWords } from './incident-words';

/** Every incident as a table: sort, filter, export; a click opens it. */
export function IncidentsGrid({ rows, loading }: { rows: IncidentView[] | undefined; loading?: boolean }) {
  const navigate = useNavigate();
  const { dateTime } = useFirmFormat();
  const columns = useMemo<ColDef<IncidentView>[]>(
    () => [
      {
        colId: 'asset',
        headerName: 'Asset',
        valueGetter: (p) => p.data?.asset?.assetTag ?? '',
        cellClass: 'font-mono font-semibold',
        minWidth: 110,
      },
      { colId: 'type', headerName: 'Type', valueGetter: (p) => (p.data?.asset ? assetTypeTitles[p.data.asset.type] : ''), minWidth: 120 },
      { colId: 'kind', headerName: 'What happened', valueGetter: (p) => (p.data ? incidentKindWords[p.data.kind] : ''), minWidth: 140 },
      {
        colId: 'when',
        headerName: 'When',
        valueGetter: (p) => (p.data ? isoTimestamp(p.data.occurredAt) : ''),
        valueFormatter: (p) => dateTime(p.value as string),
        sort: 'desc',
        minWidth: 160,
      },
      {
        colId: 'state',
        headerName: 'State',
        valueGetter: (p) => (p.data ? incidentStateWords[p.data.state] : ''),
        cellRenderer: (p: ICellRendererParams<IncidentView>) => (p.data ? <IncidentStateChip state={p.data.state} /> : null),
        minWidth: 140,
      },
      { colId: 'photos', headerName: 'Photos', valueGetter: (p) => p.data?.photos.length ?? 0, type: 'numericColumn', maxWidth: 110, minWidth: 90 },
      { colId: 'description', headerName: 'Description', valueGetter: (p) => p.data?.description ?? '', minWidth: 220, flex: 2 },
    ],
    [dateTime],
  );
  return (
    <DataGrid<IncidentView>
      label="Incidents"
      rows={rows}
      loading={loading}
      columns={columns}
      rowId={(r) => r.id}
      exportFileName="incidents.csv"
      emptyMessage="No incidents match."
      onRowClicked={(r) => navigate(`/incidents/${r.id}`)}
    />
  );
}
