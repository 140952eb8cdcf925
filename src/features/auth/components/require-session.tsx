import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { isApiError } from '../../../lib/api-client';
import { TimeZoneContext } from '../../../lib/format';
import { LoadingPanel } from '../../../components/loading-panel';
import { useMe } from '../api/get-me';
import { SecondStepOwed } from './second-step-owed';
import { SessionContext } from './session-context';

/** Renders its children only for a signed-in person; everyone else goes to /sign-in. Someone who owes the
 * second step their firm requires sets it up first (the server answers them nothing else meanwhile). */
export function RequireSession({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return <LoadingPanel label="Opening Nestkeeper…" className="justify-center py-24" />;
  }
  if (me.isError) {
    if (isApiError(me.error) && me.error.status === 401) {
      return <Navigate to="/sign-in" replace state={{ from: location.pathname }} />;
    }
    throw me.error;
  }
  return (
    <SessionContext value={me.data}>
      <TimeZoneContext value={me.data.organization.timeZone}>{me.data.secondStep.owed ? <SecondStepOwed /> : children}</TimeZoneContext>
    </SessionContext>
  );
}
