import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PaymentModeView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';

export function getPaymentMode(signal?: AbortSignal): Promise<PaymentModeView> {
  return apiClient.get<PaymentModeView>('/billing/payment-mode', { signal });
}

export const paymentModeQueryOptions = () =>
  queryOptions({ queryKey: billingKeys.paymentMode(), queryFn: ({ signal }) => getPaymentMode(signal), staleTime: Infinity });

/** Test or live keys: the clerk's test-card shortcut shows only in test mode. */
export function usePaymentMode() {
  return useQuery(paymentModeQueryOptions());
}
