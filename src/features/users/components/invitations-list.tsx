import { useState } from 'react';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { isApiError } from '../../../lib/api-client';
import { useFirmFormat } from '../../../lib/format';
import { roleTitles } from '../../../lib/roles';
import { useInvitations, useResendInvitation, useWithdrawInvitation } from '../api/invitations';

/** Invitations not yet accepted: when each runs out, and resend or withdraw. */
export function InvitationsList() {
  const invitations = useInvitations();
  const resend = useResendInvitation();
  const withdraw = useWithdrawInvitation();
  const fmt = useFirmFormat();
  const [outcome, setOutcome] = useState<{ tone: 'success' | 'error'; text: string }>();
  const report = (text: string) => ({
    onSuccess: () => setOutcome({ tone: 'success', text }),
    onError: (error: Error) => setOutcome({ tone: 'error', text: isApiError(error) ? error.message : 'That did not work. Try again.' }),
  });

  if (invitations.isError) return <Notice tone="error">{invitations.error.message}</Notice>;
  const items = invitations.data?.items ?? [];
  return (
    <div className="flex flex-col gap-3">
      {outcome ? <Notice tone={outcome.tone}>{outcome.text}</Notice> : null}
      {items.length === 0 ? (
        <p className="text-sm text-ink-700">{invitations.isPending ? 'Loading…' : 'No invitations are waiting.'}</p>
      ) : (
        <ul aria-label="Pending invitations" className="flex flex-col divide-y divide-paper-line rounded-md border border-paper-line bg-card">
          {items.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 p-3">
              <div className="min-w-0">
                <p className="flex flex-wrap items-center gap-2">
                  <span className="font-mono break-all">{i.email}</span>
                  <span className="text-sm text-ink-700">{roleTitles[i.role]}</span>
                  <StatusChip tone={i.state === 'expired' ? 'warn' : 'info'} label={i.state === 'expired' ? 'Expired' : 'Waiting'} />
                </p>
                <p className="text-sm text-ink-700">
                  Sent {fmt.dateTime(i.sentAt)}
                  {i.invitedBy ? ` by ${i.invitedBy}` : ''} · {i.state === 'expired' ? 'ran out' : 'runs out'} {fmt.dateTime(i.expiresAt)}
                </p>
              </div>
              <div className="flex gap-1.5">
                <Button
                  size="sm"
                  busy={resend.isPending && resend.variables === i.id}
                  onClick={() => resend.mutate(i.id, report(`A fresh link went to ${i.email}.`))}
                >
                  Send again
                </Button>
                <Button
                  size="sm"
                  variant="danger"
                  busy={withdraw.isPending && withdraw.variables === i.id}
                  onClick={() => withdraw.mutate(i.id, report(`The invitation to ${i.email} is withdrawn; its link no longer works.`))}
                >
                  Withdraw
                </Button>
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
