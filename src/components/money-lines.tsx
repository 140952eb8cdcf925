import { formatMoney } from '../lib/format';
import { TableHead } from './table-head';
import { ScrollBox } from './scroll-box';

export interface MoneyLine {
  key: string;
  description: string;
  /** A second line under the description, e.g. "1 month, 2 days". */
  detail?: string;
  quantity: number;
  unitMinor: number;
  amountMinor: number;
}

/** Priced lines with their totals: a quote, a settlement, an invoice. */
export function MoneyLines({
  caption,
  lines,
  totals,
  currency,
}: {
  caption: string;
  lines: MoneyLine[];
  totals: { label: string; minor: number; strong?: boolean }[];
  currency: string;
}) {
  const money = (minor: number) => formatMoney(minor, currency);
  return (
    <ScrollBox label={caption}>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <TableHead columns={['Line', 'Qty#', 'Each#', 'Amount#']} />
        <tbody className="divide-y divide-paper-line">
          {lines.map((line) => (
            <tr key={line.key}>
              <td className="py-1.5 pr-2">
                <span className="block text-ink-900">{line.description}</span>
                {line.detail ? <span className="block text-ink-700">{line.detail}</span> : null}
              </td>
              <td className="py-1.5 pr-2 text-right tabular-nums">{line.quantity}</td>
              <td className="py-1.5 pr-2 text-right tabular-nums">{money(line.unitMinor)}</td>
              <td className="py-1.5 text-right tabular-nums">{money(line.amountMinor)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot className="border-t-2 border-paper-line">
          {totals.map((t) => (
            <tr key={t.label} className={t.strong ? 'font-bold text-ink-900' : 'text-ink-800'}>
              <th scope="row" colSpan={3} className="py-1 pr-2 text-right font-semibold">
                {t.label}
              </th>
              <td className="py-1 text-right tabular-nums">{money(t.minor)}</td>
            </tr>
          ))}
        </tfoot>
      </table>
    </ScrollBox>
  );
}
