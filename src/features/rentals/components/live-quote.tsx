import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useQuote } from '../api/get-quote';
import type { RentalScope } from '../api/keys';
import { QuoteLines } from './quote-lines';

/** The price as the form stands, asked again a moment after each change. */
export function LiveQuote({ scope }: { scope: RentalScope | null }) {
  // Debounce the scope's text: a new object every render would never settle.
  const settledKey = useDebouncedValue(scope ? JSON.stringify(scope) : '', 400);
  const settled = useMemo(() => (settledKey ? (JSON.parse(settledKey) as RentalScope) : null), [settledKey]);
  const quote = useQuote(settled);

  return (
    <section aria-labelledby="quote-heading" className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4">
      <h2 id="quote-heading" className="font-semibold text-ink-900">
        Price
      </h2>
      <div aria-live="polite" className="flex flex-col gap-2">
        {!scope ? (
          <p className="text-sm text-ink-700">The price appears once a kit or an item and both dates are chosen.</p>
        ) : quote.isError ? (
          <Notice tone={isApiError(quote.error) && quote.error.code === 'no_rate' ? 'caution' : 'error'} title="No price yet">
            {quote.error.message}{' '}
            {isApiError(quote.error) && quote.error.code === 'no_rate' ? (
              <Link to="/customers#rates" className="font-semibold text-brass-deep underline">
                Set up rates
              </Link>
            ) : null}
          </Notice>
        ) : quote.data ? (
          <>
            <p className="text-sm text-ink-800">
              {quote.data.days} rental {quote.data.days === 1 ? 'day' : 'days'}, both dates included.
              {quote.isFetching || settledKey !== JSON.stringify(scope) ? <span className="ml-2 text-ink-500">Updating…</span> : null}
            </p>
            <QuoteLines quote={quote.data} />
          </>
        ) : (
          <LoadingPanel label="Working out the price…" className="py-2" />
        )}
      </div>
    </section>
  );
}
