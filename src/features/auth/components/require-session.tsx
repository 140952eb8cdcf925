import { useQuery } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { isApiError } from '../../../lib/api-client';
import { readCopy } from '../../../lib/field/field-store';
import { adoptFirmVoice, FirmFormatContext } from '../../../lib/format';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { DEFAULT_LOCALE } from '../../../../shared/formatting/firm-format';
import { useMe } from '../api/get-me';
import { authKeys } from '../api/keys';
import { SecondStepOwed } from './second-step-owed';
import { SessionContext } from './session-context';

/**
 * Renders its children only for a signed-in person; everyone else goes to /sign-in. Someone who owes the second step
 * their firm requires sets it up first (the server answers them nothing else meanwhile). Without signal, the session kept
 * with the phone's field copy stands in until the server answers again (it ends at sign-out, which erases the copy).
 */
type Firm = { locale?: string; timeZone: string; currency: string };
// A phone's field copy kept from before firms had a locale carries none: the default stands in.
const voiceOf = (firm: Firm) => ({ locale: firm.locale ?? DEFAULT_LOCALE, timeZone: firm.timeZone, currency: firm.currency });
const voiceKey = (firm: Firm) => Object.values(voiceOf(firm)).join('|');

export function RequireSession({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  const noSignal = (me.isPending && me.fetchStatus === 'paused') || (me.isError && isApiError(me.error) && me.error.status === 0);
  const kept = useQuery({
    queryKey: authKeys.keptOnPhone(),
    queryFn: async () => (await readCopy())?.session ?? null,
    enabled: noSignal,
    networkMode: 'always',
    staleTime: Infinity,
  });
  const session = me.data ?? (noSignal ? kept.data : null);

  if (session) {
    return (
      <SessionContext value={session}>
        {/* Keyed by the voice: a change of locale or zone redraws every screen in it, memoized ones included. */}
        <FirmFormatContext key={voiceKey(session.organization)} value={adoptFirmVoice(voiceOf(session.organization))}>
          {session.secondStep?.owed ? <SecondStepOwed /> : children}
        </FirmFormatContext>
      </SessionContext>
    );
  }
  if (noSignal && !kept.isPending) {
    return (
      <Notice tone="info" title="No signal" className="m-4">
        This phone has no copy of your kit yet. Open Nestkeeper once with signal and sign in; after that your kit, checks and damage reports work without
        signal.
      </Notice>
    );
  }
  if (me.isPending || noSignal) return <LoadingPanel label="Opening Nestkeeper…" className="justify-center py-24" />;
  if (me.data === null) return <Navigate to="/sign-in" replace state={{ from: location.pathname }} />;
  throw me.error;
}
