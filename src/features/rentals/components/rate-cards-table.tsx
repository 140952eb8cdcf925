import type { ColDef } from 'ag-grid-community';
import { useMemo } from 'react';
import { DataGrid } from '../../../components/data-grid';
import { assetTypeTitles } from '../../../lib/assets';
import { formatMoney } from '../../../lib/format';
import type { RateCardView } from '../../../../shared/billing/views';

type RateCardRow = RateCardView & { subject: string };

/** The firm's rental rates: per asset type, and per kit for kits that rent as one line. */
export function RateCardsTable({
  cards,
  kits,
  currency,
  onOpen,
}: {
  cards: RateCardView[] | undefined;
  kits: { id: string; name: string }[];
  currency: string;
  onOpen?: (card: RateCardView) => void;
}) {
  // The subject's words live in the rows, so the table redraws when the kit names arrive.
  const rows = useMemo(() => {
    const kitNames = new Map(kits.map((k) => [k.id, k.name]));
    return cards?.map((c) => ({
      ...c,
      subject: c.kitId ? `Kit: ${kitNames.get(c.kitId) ?? 'a kit no longer listed'}` : c.assetType ? assetTypeTitles[c.assetType] : '',
    }));
  }, [cards, kits]);
  const columns = useMemo<ColDef<RateCardRow>[]>(() => {
    const money = (key: 'dayMinor' | 'weekMinor' | 'monthMinor' | 'lateFeePerDayMinor', headerName: string): ColDef<RateCardRow> => ({
      headerName,
      field: key,
      type: 'numericColumn',
      minWidth: 120,
      valueFormatter: (p) => formatMoney(p.value as number, currency),
    });
    return [
      { headerName: 'Rates for', field: 'subject', minWidth: 200, flex: 2, sort: 'asc' },
      money('dayMinor', 'Day'),
      money('weekMinor', 'Week (7 days)'),
      money('monthMinor', 'Month (28 days)'),
      money('lateFeePerDayMinor', 'Late fee per day'),
    ];
  }, [currency]);
  return (
    <DataGrid<RateCardRow>
      label="Rate cards"
      rows={rows}
      columns={columns}
      rowId={(c) => c.id}
      quickFilter={false}
      exportFileName="nestkeeper-rate-cards.csv"
      emptyMessage="No rates yet: a rental cannot be priced until its item types or its kit have rates."
      onRowClicked={onOpen}
    />
  );
}
