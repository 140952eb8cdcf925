import { createContext, useContext } from 'react';
import type { SessionView } from '../../../../shared/auth/views';

export const SessionContext = createContext<SessionView | null>(null);

/** The signed-in person and organization. Only valid below <RequireSession>. */
export function useSession(): SessionView {
  const session = useContext(SessionContext);
  if (!session) throw new Error('useSession() used outside <RequireSession>');
  return session;
}
