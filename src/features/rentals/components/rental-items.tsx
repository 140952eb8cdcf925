import { AssetRowHeader } from '../../../components/asset-row-header';
import { Panel } from '../../../components/panel';
import { BatteryCaution, HeavyCaseCaution, LaserCaution } from '../../../components/safety-cautions';
import { assetTypeTitles, type AssetType } from '../../../lib/assets';
import type { RentalItem } from '../../../../shared/billing/views';
import { TableHead } from '../../../components/table-head';
import { ScrollBox } from '../../../components/scroll-box';

/** What the renter takes: tag, type, serial and model of every item. */
export function RentalItems({ items }: { items: RentalItem[] }) {
  return (
    <Panel title={`Items (${items.length})`}>
      <ScrollBox label="Rented items">
        <table className="w-full text-left text-sm">
          <TableHead columns={['Tag', 'Type', 'Serial', 'Model']} />
          <tbody className="divide-y divide-paper-line">
            {items.map((item) => (
              <tr key={item.id}>
                <AssetRowHeader id={item.id} tag={item.assetTag} />
                <td className="py-1.5 pr-2">{assetTypeTitles[item.type as AssetType] ?? item.type}</td>
                <td className="py-1.5 pr-2 font-mono">{item.serialNumber}</td>
                <td className="py-1.5 pr-2">{[item.manufacturer, item.model].filter(Boolean).join(' ') || '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollBox>
    </Panel>
  );
}

/** DESIGN.md §6, where kit is handed to a renter: the cautions its items call for (none when nothing applies). */
export function RenterCautions({ items }: { items: Pick<RentalItem, 'type'>[] }) {
  const types = new Set(items.map((i) => i.type));
  const cautions = [
    types.has('tracker') ? <LaserCaution key="laser" /> : null,
    types.has('tracker') || types.has('case') ? <HeavyCaseCaution key="heavy" /> : null,
    types.has('battery') ? <BatteryCaution key="battery" /> : null,
  ].filter(Boolean);
  if (!cautions.length) return null;
  return (
    <section aria-label="Safety cautions for the renter" className="flex flex-col gap-2">
      {cautions}
    </section>
  );
}
