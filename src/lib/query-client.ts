import { MutationCache, onlineManager, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

type SessionEndedHandler = (key: readonly unknown[] | undefined) => void;

/** Called when any read or write comes back 401 (the session has ended) or 403 `second_step_required` (the firm now
 * requires a second step this person lacks), with that query's or mutation's key. */
let onSessionEnded: SessionEndedHandler | undefined;
export function setSessionEndedHandler(handler: SessionEndedHandler | undefined): void {
  onSessionEnded = handler;
}

function noticeSessionEnd(error: unknown, key: readonly unknown[] | undefined): void {
  if (isApiError(error) && (error.status === 401 || error.code === 'second_step_required')) onSessionEnded?.(key);
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => noticeSessionEnd(error, query.queryKey) }),
    mutationCache: new MutationCache({
      onError: (error, _vars, _ctx, mutation) => noticeSessionEnd(error, mutation.options.mutationKey),
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx will not change by asking again; network and 5xx get two more tries. While the database is away a read
        // keeps waiting (what was on screen stays, the banner says why) and is asked again when it is back.
        retry: (failureCount, error) => (isApiError(error) && error.isDatabaseAway) || (!(isApiError(error) && error.isClientError) && failureCount < 2),
        retryDelay: (failureCount, error) => (isApiError(error) && error.isDatabaseAway ? 5_000 : Math.min(1000 * 2 ** failureCount, 30_000)),
      },
      mutations: { retry: false },
    },
  });
}

// TanStack Query assumes a network until the first `offline` event; a page opened without one knows at once.
if (typeof navigator !== 'undefined' && navigator.onLine === false) onlineManager.setOnline(false);

export const queryClient = createQueryClient();
