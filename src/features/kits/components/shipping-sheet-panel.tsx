import { buttonClasses } from '../../../components/button';
import { DownloadIcon } from '../../../components/icons';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { BatteryCaution } from '../../../components/safety-cautions';
import { StatusChip, type StatusTone } from '../../../components/status-chip';
import { formatWattHours, shippingClassText, type ShippingClass } from '../../../lib/batteries';
import { formatNumber } from '../../../lib/format';
import { shippingSheetPdfUrl, useShippingSheet } from '../api/get-shipping-sheet';
import { ScrollBox } from '../../../components/scroll-box';

const classTone: Record<ShippingClass, StatusTone> = {
  up_to_100_wh: 'ok',
  over_100_to_160_wh: 'warn',
  over_160_wh: 'warn',
  damaged_do_not_fly: 'bad',
};
const classShort: Record<ShippingClass, string> = {
  up_to_100_wh: 'Up to 100 Wh',
  over_100_to_160_wh: 'Over 100 to 160 Wh',
  over_160_wh: 'Over 160 Wh',
  damaged_do_not_fly: 'Damaged',
};

/** The kit's lithium-ion batteries for a carrier: Wh and class per battery, the total and the cautions. */
export function ShippingSheetPanel({ kitId }: { kitId: string }) {
  const sheet = useShippingSheet(kitId);
  return (
    <section aria-labelledby="shipping-sheet-heading" className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="shipping-sheet-heading" className="text-lg font-bold">
          Battery shipping sheet
        </h2>
        <a href={shippingSheetPdfUrl(kitId)} target="_blank" rel="noopener" className={buttonClasses('secondary', 'sm')}>
          <DownloadIcon size={14} />
          Shipping sheet PDF
        </a>
      </div>
      {sheet.isPending ? <LoadingPanel label="Adding up the batteries…" /> : null}
      {sheet.isError ? (
        <Notice tone="error" title="The shipping sheet could not be loaded">
          {sheet.error.message}
        </Notice>
      ) : null}
      {sheet.data ? (
        sheet.data.lines.length === 0 ? (
          <p className="text-ink-700">This kit has no batteries.</p>
        ) : (
          <>
            <ScrollBox label="Batteries in the kit">
              <table className="w-full text-left">
                <caption className="sr-only">Batteries in the kit with their energy and shipping class</caption>
                <thead className="bg-paper-deep text-sm">
                  <tr>
                    <th scope="col" className="px-2 py-1.5">
                      Battery
                    </th>
                    <th scope="col" className="px-2 py-1.5 text-right">
                      Voltage
                    </th>
                    <th scope="col" className="px-2 py-1.5 text-right">
                      Capacity
                    </th>
                    <th scope="col" className="px-2 py-1.5 text-right">
                      Energy
                    </th>
                    <th scope="col" className="px-2 py-1.5">
                      Class
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {sheet.data.lines.map((line) => (
                    <tr key={line.assetId} className="border-t border-paper-line">
                      <td className="px-2 py-1.5 font-mono font-semibold whitespace-nowrap">{line.assetTag}</td>
                      <td className="px-2 py-1.5 text-right">{formatNumber(line.nominalVoltageV, 2)} V</td>
                      <td className="px-2 py-1.5 text-right">{formatNumber(line.ratedCapacityAh, 3)} Ah</td>
                      <td className="px-2 py-1.5 text-right font-semibold">{formatWattHours(line.wattHours)}</td>
                      <td className="px-2 py-1.5">
                        <StatusChip tone={classTone[line.class]} label={classShort[line.class]} title={shippingClassText[line.class]} />
                      </td>
                    </tr>
                  ))}
                </tbody>
                <tfoot>
                  <tr className="border-t-2 border-paper-line font-semibold">
                    <th scope="row" colSpan={3} className="px-2 py-1.5 text-left">
                      Total, {sheet.data.count} {sheet.data.count === 1 ? 'battery' : 'batteries'}
                    </th>
                    <td className="px-2 py-1.5 text-right">{formatWattHours(sheet.data.totalWattHours)}</td>
                    <td />
                  </tr>
                </tfoot>
              </table>
            </ScrollBox>
            {sheet.data.strictest ? (
              <p>
                <span className="font-semibold">Strictest class in the kit:</span> {shippingClassText[sheet.data.strictest]}
              </p>
            ) : null}
            {sheet.data.strictest === 'damaged_do_not_fly' ? (
              <Notice tone="error" title="A damaged battery is in this kit">
                Take it out before the kit travels. Do not charge it and do not ship it by air.
              </Notice>
            ) : null}
          </>
        )
      ) : null}
      <BatteryCaution />
    </section>
  );
}
