import { useState } from 'react';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Notice } from '../../../components/notice';
import { paymentProblem } from './payment-problem';

/**
 * Asks once before money or mail leaves: says what will happen, in the firm's money and with the mail's recipient, and
 * acts on the one button. A refusal stays in the dialog with its reason.
 */
export function MoneyConfirmation({
  open,
  onClose,
  title,
  what,
  mailTo,
  confirmLabel,
  onConfirm,
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  /** What will happen, as a sentence: "€416.50 captured, €9,703.50 released". */
  what: string;
  /** What is mailed and to whom: "the customer is told by mail at finance@…". */
  mailTo: string;
  confirmLabel: string;
  onConfirm: () => Promise<unknown>;
}) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string>();
  const close = () => {
    setProblem(undefined);
    onClose();
  };
  async function confirm() {
    setBusy(true);
    setProblem(undefined);
    try {
      await onConfirm();
      close();
    } catch (error) {
      setProblem(paymentProblem(error));
    } finally {
      setBusy(false);
    }
  }
  return (
    <Dialog open={open} onClose={close} title={title} description={<p className="text-base text-ink-900">{`${what}; ${mailTo}.`}</p>}>
      <div className="flex flex-col gap-3">
        {problem ? (
          <Notice tone="error" title="Not done as asked">
            {problem}
          </Notice>
        ) : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button onClick={close} disabled={busy}>
            Cancel
          </Button>
          <Button variant="primary" busy={busy} onClick={() => void confirm()}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
