import { createContext, useContext } from 'react';
import type { Session } from '../api/types';

export const SessionContext = createContext<Session | null>(null);

/** The signed-in person and organization. Only valid below <RequireSession>. */
export function useSession(): Session {
  const session = useContext(SessionContext);
  if (!session) throw new Error('useSession() used outside <RequireSession>');
  return session;
}
