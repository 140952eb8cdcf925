import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ErrorBoundary } from '../components/error-fallback';
import { OutageBanner } from '../components/outage-banner';
import { authKeys } from '../features/auth/api/keys';
import { onDatabaseBack } from '../lib/database-outage';
import { queryClient, setSessionEndedHandler } from '../lib/query-client';

// Any 401 outside the auth calls themselves means the session ended (expired,
// signed out elsewhere, user disabled): re-ask "who am I?", and the session
// gate (features/auth RequireSession) sends the person to /sign-in, or to the
// second-step setup when the firm has just required one of them.
setSessionEndedHandler((key) => {
  if (key && key[0] === authKeys.all[0]) return;
  void queryClient.invalidateQueries({ queryKey: authKeys.me() });
});

// The database is back: fetch again whatever is on screen (reads waiting on a retry included).
onDatabaseBack(() => void queryClient.invalidateQueries());

/**
 * App-wide providers. The signed-in session itself is provided by
 * RequireSession inside the router, because redirecting needs the router.
 */
export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <ErrorBoundary>
      <QueryClientProvider client={queryClient}>
        <OutageBanner />
        {children}
      </QueryClientProvider>
    </ErrorBoundary>
  );
}
