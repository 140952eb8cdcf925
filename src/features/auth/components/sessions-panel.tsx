import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/button';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { useFirmFormat } from '../../../lib/format';
import { useEndSession, useSessions, useSignOutEverywhere } from '../api/sessions';

/** A browser's User-Agent in a few words a person recognises. */
export function deviceName(userAgent: string): string {
  if (!userAgent) return 'Unknown device';
  const browser = /Edg\//.test(userAgent)
    ? 'Edge'
    : /Firefox\//.test(userAgent)
      ? 'Firefox'
      : /Chrom(e|ium)\//.test(userAgent)
        ? 'Chrome'
        : /Safari\//.test(userAgent)
          ? 'Safari'
          : null;
  const system = /Android/.test(userAgent)
    ? 'Android'
    : /iPhone|iPad/.test(userAgent)
      ? 'iPhone or iPad'
      : /Windows/.test(userAgent)
        ? 'Windows'
        : /Mac OS X/.test(userAgent)
          ? 'Mac'
          : /Linux/.test(userAgent)
            ? 'Linux'
            : null;
  return browser && system ? `${browser} on ${system}` : userAgent.slice(0, 60);
}

/** Where the person is signed in, with an end button per session and "sign out everywhere". */
export function SessionsPanel() {
  const sessions = useSessions();
  const end = useEndSession();
  const navigate = useNavigate();
  const everywhere = useSignOutEverywhere({ onSignedOut: () => navigate('/sign-in', { replace: true }) });
  const fmt = useFirmFormat();

  if (sessions.isPending) return <LoadingPanel />;
  if (sessions.isError) return <Notice tone="error">{sessions.error.message}</Notice>;
  return (
    <div className="flex flex-col gap-3">
      <ul className="flex flex-col divide-y divide-paper-line rounded-md border border-paper-line">
        {sessions.data.items.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 p-3">
            <div className="min-w-0">
              <p className="flex flex-wrap items-center gap-2 font-semibold">
                {deviceName(s.device)}
                {s.current ? <StatusChip tone="info" label="This device" /> : null}
              </p>
              <p className="text-sm text-ink-700">
                Signed in {fmt.dateTime(s.signedInAt)} · last seen {fmt.dateTime(s.lastSeenAt)}
              </p>
            </div>
            {s.current ? null : (
              <Button size="sm" busy={end.isPending && end.variables === s.id} onClick={() => end.mutate(s.id)}>
                Sign out this device
              </Button>
            )}
          </li>
        ))}
      </ul>
      <div>
        <Button variant="danger" busy={everywhere.isPending} onClick={() => everywhere.mutate()}>
          Sign out everywhere
        </Button>
        <p className="mt-1 text-sm text-ink-700">Ends every session, this one too, and every token a script holds. Sign in again afterwards.</p>
      </div>
    </div>
  );
}
