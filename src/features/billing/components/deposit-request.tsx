import QRCode from 'qrcode';
import { useEffect, useState } from 'react';
import type { DepositRequestState, DepositRequestView, DepositRequestReply } from '../../../../shared/billing/views';
import { Button } from '../../../components/button';
import { MailIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { FactList } from '../../../components/panel';
import { StatusChip, type StatusTone } from '../../../components/status-chip';
import { useFirmFormat } from '../../../lib/format';
import { useRequestDeposit } from '../api/request-deposit';
import { paymentProblem } from './payment-problem';

const requestStates: Record<DepositRequestState, [string, StatusTone]> = {
  waiting: ['Waiting for the renter', 'busy'],
  authorized: ['Authorized by the renter', 'ok'],
  declined: ['Declined', 'bad'],
  expired: ['Link expired', 'warn'],
};

/** A QR code of the hosted page, so a renter at the counter can open it on their own phone (ISO/IEC 18004, drawn by the `qrcode` package). */
function LinkCode({ url }: { url: string }) {
  const [image, setImage] = useState<string>();
  useEffect(() => {
    let live = true;
    void QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 4, width: 176 }).then((data) => live && setImage(data));
    return () => {
      live = false;
    };
  }, [url]);
  return image ? (
    <img src={image} width={176} height={176} alt="QR code of the payment page, for the renter's phone" className="rounded border border-paper-line" />
  ) : null;
}

/**
 * The renter places the deposit themselves: the clerk sends a link (mailed to
 * the customer's billing address) to the renter's page, which leads to the
 * payment provider's page; the state follows the provider's signed events.
 */
export function DepositRequest({ rentalId, request, sentTo }: { rentalId: string; request: DepositRequestView | null; sentTo: string }) {
  const { dateTime } = useFirmFormat();
  const send = useRequestDeposit();
  const [sent, setSent] = useState<DepositRequestReply>();
  const [problem, setProblem] = useState<string>();
  const ask = async () => {
    setProblem(undefined);
    try {
      setSent(await send.mutateAsync(rentalId));
    } catch (error) {
      setProblem(paymentProblem(error));
    }
  };
  const [label, tone] = request ? requestStates[request.state] : [];
  return (
    <section aria-labelledby="renter-link" className="flex flex-col gap-3 rounded-md border border-paper-line bg-paper p-3">
      <h3 id="renter-link" className="font-semibold text-ink-900">
        Renter’s link
      </h3>
      {problem ? (
        <Notice tone="error" title="No link was sent">
          {problem}
        </Notice>
      ) : null}
      {request && label && tone ? (
        <div className="flex flex-col gap-3">
          <div className="min-w-0 flex-1">
            <FactList
              items={[
                { term: 'Link', value: <StatusChip tone={tone} label={label} /> },
                { term: 'Sent to', value: request.sentTo, mono: true },
                { term: 'Sent', value: dateTime(request.createdAt) },
                { term: request.state === 'expired' ? 'Expired' : 'Payment page until', value: dateTime(request.expiresAt) },
                ...(request.state === 'declined' && request.declineMessage ? [{ term: 'Last card', value: request.declineMessage }] : []),
                ...(request.url
                  ? [
                      {
                        term: 'Payment page',
                        value: (
                          <a href={request.url} target="_blank" rel="noopener noreferrer" className="break-all font-mono text-sm text-brass-deep underline">
                            {request.url}
                          </a>
                        ),
                      },
                    ]
                  : []),
              ]}
            />
            {request.state === 'waiting' ? <p className="mt-2 text-sm text-ink-700">This page updates by itself when the provider confirms the card.</p> : null}
            {sent ? (
              <p className="mt-2 text-sm text-ink-700">
                The renter’s own page (agreement, certificates, deposit) went by e-mail; it opens without sign-in until {dateTime(sent.renterLinkExpiresAt)}:{' '}
                <span className="break-all font-mono">{sent.renterUrl}</span>
              </p>
            ) : null}
          </div>
          {request.url ? <LinkCode url={request.url} /> : null}
        </div>
      ) : (
        <p className="text-sm text-ink-700">
          The renter reads and accepts the agreement on their own page and types the card on the payment provider’s page; the card never reaches Nestkeeper. The
          link goes to {sentTo}.
        </p>
      )}
      {request?.state !== 'authorized' ? (
        <div>
          <Button variant={request ? 'secondary' : 'primary'} busy={send.isPending} icon={<MailIcon size={16} />} onClick={() => void ask()}>
            {request ? 'Send a new link' : 'Send the renter a link'}
          </Button>
          {request ? <span className="ml-3 text-sm text-ink-700">The link sent before stops working.</span> : null}
        </div>
      ) : null}
    </section>
  );
}
