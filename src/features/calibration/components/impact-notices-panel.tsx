import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Notice } from '../../../components/notice';
import { Panel } from '../../../components/panel';
import { useFirmFormat } from '../../../lib/format';
import { assetImpactQueryOptions } from '../api/get-asset-impact';
import { useCreateImpactNotices, type EditedNotice } from '../api/create-impact-notices';
import type { ImpactNoticesView, ImpactReviewView } from '../../../../shared/calibration/views';
import { noticeGroupWords } from './calibration-words';

type Draft = ImpactNoticesView['drafts'][number];
const SUBJECT_MAX = 200;
const TEXT_MAX = 20_000;

const listWords = (items: string[]) => new Intl.ListFormat('en', { type: 'conjunction' }).format(items);
const noticesWord = (n: number) => `${n} ${n === 1 ? 'notice' : 'notices'}`;

/** One draft, editable: the subject and the letter; the signature is added from the firm's settings. */
function DraftEditor({
  draft,
  edit,
  onChange,
  sender,
}: {
  draft: Draft;
  edit: EditedNotice;
  onChange: (e: EditedNotice) => void;
  sender: ImpactNoticesView['sender'];
}) {
  const subjectMissing = !edit.subject.trim();
  const textMissing = !edit.text.trim();
  return (
    <li className="flex flex-col gap-2 rounded-md border border-paper-line p-3">
      <p className="text-sm">
        <span className="font-semibold">To:</span> {draft.customerName ? `${draft.customerName} <${draft.to}>` : draft.to}
      </p>
      <p className="text-sm">
        <span className="font-semibold">Notice:</span> {noticeGroupWords[draft.group]} ({listWords(draft.jobReferences)})
      </p>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Subject of the notice to {draft.to}
        <input
          value={edit.subject}
          maxLength={SUBJECT_MAX}
          aria-invalid={subjectMissing || undefined}
          onChange={(e) => onChange({ ...edit, subject: e.target.value })}
          className="rounded-md border border-paper-line bg-card px-3 py-1 text-base font-normal"
        />
      </label>
      {subjectMissing ? <p className="text-sm text-bad">A notice needs a subject.</p> : null}
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Text of the notice to {draft.to}
        <textarea
          value={edit.text}
          maxLength={TEXT_MAX}
          rows={14}
          aria-invalid={textMissing || undefined}
          onChange={(e) => onChange({ ...edit, text: e.target.value })}
          className="rounded-md border border-paper-line bg-card px-3 py-2 text-base font-normal"
        />
      </label>
      {textMissing ? <p className="text-sm text-bad">A notice needs its text.</p> : null}
      <p className="text-sm text-ink-700">
        Signed below the text: {sender.name}
        {sender.address ? `, ${sender.address.replace(/\s*\n\s*/g, ', ')}` : ''}.
      </p>
    </li>
  );
}

/** After sending: each notice and when it reached the mail server, read from the review (refreshed while any waits). */
function Delivery({ review, sent, queuedAt }: { review: ImpactReviewView; sent: Draft[]; queuedAt: string }) {
  const fmt = useFirmFormat();
  const sentAtOf = (d: Draft, r: ImpactReviewView) => r.bookings.find((b) => d.bookingIds.includes(b.bookingId))?.noticeSentAt ?? null;
  const waiting = sent.some((d) => !sentAtOf(d, review));
  const live = useQuery({ ...assetImpactQueryOptions(review.assetId), refetchInterval: waiting ? 5000 : false });
  const current = live.data && live.data.state !== 'none' ? live.data : review;
  return (
    <Notice tone="success" title={`${noticesWord(sent.length)} queued at ${fmt.time(queuedAt)}`}>
      <ul className="mt-1 flex flex-col gap-1">
        {sent.map((d) => {
          const at = sentAtOf(d, current);
          return (
            <li key={`${d.to}-${d.group}`}>
              {d.to}: {at ? `sent ${fmt.dateTime(at)}` : 'waiting to send'}
            </li>
          );
        })}
      </ul>
      <Link to="/mailbox" className="font-semibold underline">
        See the mailbox
      </Link>
    </Notice>
  );
}

/** Customer notices: drafted, read and edited, sent after one confirmation, then followed until each has gone. */
export function ImpactNoticesPanel({ review }: { review: ImpactReviewView }) {
  const notices = useCreateImpactNotices(review.assetId);
  const [edits, setEdits] = useState<EditedNotice[]>([]);
  const [confirming, setConfirming] = useState(false);
  const result = notices.data;
  const drafts = result && !result.sent ? result.drafts : [];
  const complete = edits.length > 0 && edits.every((e) => e.subject.trim() && e.text.trim());
  const open = review.state === 'open';

  const draft = () =>
    notices.mutate(
      { reviewId: review.id, send: false },
      { onSuccess: (r) => setEdits(r.drafts.map((d) => ({ to: d.to, group: d.group, subject: d.subject, text: d.text }))) },
    );
  const send = () => notices.mutate({ reviewId: review.id, send: true, notices: edits }, { onSettled: () => setConfirming(false) });

  return (
    <Panel title="Customer notices">
      <p className="mb-3 text-sm text-ink-700">
        One notice per customer and assessment, for customers with a contact e-mail: it says what was found and what we propose. Draft them, read and edit each
        one, then send.
      </p>
      <div className="mb-3 flex flex-wrap gap-2">
        <Button busy={notices.isPending && notices.variables?.send === false} disabled={notices.isPending} onClick={draft}>
          {drafts.length ? 'Draft again from the review' : 'Draft notices'}
        </Button>
        {drafts.length ? (
          <Button variant="primary" disabled={notices.isPending || !open || !complete} onClick={() => setConfirming(true)}>
            Send {noticesWord(drafts.length)}…
          </Button>
        ) : null}
      </div>
      {notices.isError ? <Notice tone="error">{notices.error.message}</Notice> : null}
      {result?.drafts.length === 0 ? (
        <Notice tone="info" title="No notice to send">
          None of these bookings has a customer contact e-mail. Tell the customers another way and note it on each booking.
        </Notice>
      ) : null}
      {result?.sent ? (
        <Delivery review={review} sent={result.drafts} queuedAt={notices.submittedAt ? new Date(notices.submittedAt).toISOString() : ''} />
      ) : null}
      {drafts.length ? (
        <>
          <p className="mb-2 font-semibold">
            {drafts.length} {drafts.length === 1 ? 'draft' : 'drafts'} — nothing has been sent yet.
          </p>
          <ul className="flex flex-col gap-3">
            {drafts.map((d, i) =>
              edits[i] ? (
                <DraftEditor
                  key={`${d.to}-${d.group}`}
                  draft={d}
                  edit={edits[i]}
                  sender={result!.sender}
                  onChange={(e) => setEdits((all) => all.map((x, j) => (j === i ? e : x)))}
                />
              ) : null,
            )}
          </ul>
          <Dialog
            open={confirming}
            onClose={() => setConfirming(false)}
            title={`Send ${noticesWord(drafts.length)}?`}
            description={
              <p>
                {noticesWord(drafts.length)} {drafts.length === 1 ? 'goes' : 'go'} to {listWords(drafts.map((d) => d.to))}; sent from {result!.sender.name}
                {result!.sender.replyTo
                  ? ` with replies to ${result!.sender.replyTo}.`
                  : '. No reply address is set (Settings → Mail), so replies reach the sending address.'}
              </p>
            }
          >
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={() => setConfirming(false)}>Keep editing</Button>
              <Button variant="primary" busy={notices.isPending} onClick={send}>
                Send now
              </Button>
            </div>
          </Dialog>
        </>
      ) : null}
    </Panel>
  );
}
