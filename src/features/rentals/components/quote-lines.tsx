import { formatMoney, formatNumber } from '../../../lib/format';
import type { Quote } from '../../../../shared/billing/views';
import { periodWords } from '../../../../shared/billing/quote';
import { MoneyLines } from '../../../components/money-lines';

/** A rental's price: each line with its periods, then subtotal, tax, total, and the deposit to hold. */
export function QuoteLines({ quote }: { quote: Quote }) {
  return (
    <div className="flex flex-col gap-2">
      <MoneyLines
        caption={`Price for ${quote.days} rental days`}
        currency={quote.currency}
        lines={quote.lines.map((line, i) => ({
          key: `${line.kitId ?? line.description}-${i}`,
          description: line.description,
          detail: periodWords(line.periods),
          quantity: line.quantity,
          unitMinor: line.unitMinor,
          amountMinor: line.amountMinor,
        }))}
        totals={[
          { label: 'Subtotal', minor: quote.subtotalMinor },
          { label: `Tax (${formatNumber(quote.taxRateBasisPoints / 100, 2)} %)`, minor: quote.taxMinor },
          { label: 'Total', minor: quote.totalMinor, strong: true },
        ]}
      />
      <p className="text-sm text-ink-800">
        <span className="font-semibold">Deposit, authorized on the renter&rsquo;s card: </span>
        {formatMoney(quote.depositMinor, quote.currency)}
      </p>
    </div>
  );
}
