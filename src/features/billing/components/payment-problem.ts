import { isApiError } from '../../../lib/api-client';

/** A payment call's failure in words; a provider that did not answer can be asked again safely. */
export function paymentProblem(error: unknown): string {
  if (isApiError(error) && error.code === 'payment_unavailable') {
    return 'The payment provider did not answer. Try again; nothing is charged twice.';
  }
  return error instanceof Error ? error.message : 'Something went wrong. Try again.';
}
