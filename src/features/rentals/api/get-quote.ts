import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Quote } from '../../../../shared/billing/views';
import { rentalsKeys, type RentalScope } from './keys';

/** The price of a rental before it is made: lines with their periods, tax, total and the deposit to hold. */
export function getQuote(scope: RentalScope, signal?: AbortSignal): Promise<Quote> {
  return apiClient.get<Quote>('/quotes', {
    query: {
      kitId: scope.kitId,
      assetIds: scope.assetIds?.length ? scope.assetIds.join(',') : undefined,
      startsOn: scope.startsOn,
      endsOn: scope.endsOn,
      customerId: scope.customerId,
    },
    signal,
  });
}

export const quoteQueryOptions = (scope: RentalScope) =>
  queryOptions({ queryKey: rentalsKeys.quote(scope), queryFn: ({ signal }) => getQuote(scope, signal), placeholderData: keepPreviousData });

/** `scope` null while the form does not yet say what and when. */
export function useQuote(scope: RentalScope | null) {
  return useQuery({ ...quoteQueryOptions(scope ?? { startsOn: '', endsOn: '' }), enabled: !!scope });
}
