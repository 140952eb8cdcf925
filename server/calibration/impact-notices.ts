import { allowanceWords, type TriageFacts } from '../../shared/calibration/triage';
import type { ImpactBookingView, ImpactReviewView, NoticeGroup } from '../../shared/calibration/views';

type Row = ImpactBookingView & { jobReference: string };

const um = (v: number) => `${v.toFixed(1)} µm`;
const triageOf = (b: ImpactBookingView): TriageFacts => b.triage ?? b.suggestion;

/** "J-2611 (bore position ±25 µm): 9.5 µm found, up to 6.2 µm would be a quarter of 25.0 µm" */
function comparison(b: Row): string {
  const t = triageOf(b);
  const what = t.toleranceNote ? `${b.jobReference} (${t.toleranceNote})` : b.jobReference;
  if (t.toleranceUm === null || t.allowanceUm === null || t.asFoundErrorUm === null) return `${what}: ${t.reason}`;
  const at = t.distanceM !== null && t.tolerance?.kind === 'range' ? ` at ${t.distanceM} m` : '';
  return `${what}: an error of ${um(t.asFoundErrorUm)} against your tolerance of ${um(t.toleranceUm)}${at}; up to ${um(t.allowanceUm)} would be ${allowanceWords(t.ratio)} of it.`;
}

const proposals: Record<NoticeGroup, { subject: string; finding: string; proposal: string }> = {
  no_effect: {
    subject: 'no effect on your results is likely',
    finding: 'We compared that error with the tightest tolerance on record for your work, and it uses only a small share of it:',
    proposal:
      'What we propose: we believe your results stand and no re-measurement is needed. If you would like the figures in more detail, reply to this e-mail.',
  },
  remeasure_offered: {
    subject: 'we propose a re-measurement',
    finding: 'We compared that error with the tightest tolerance on record for your work, and it uses more of it than we accept:',
    proposal:
      'What we propose: to re-measure the affected features at no cost to you. Reply with days that suit you and we will book the work; until then, treat the affected results with caution.',
  },
  customer_notified: {
    subject: 'we need your tolerance to judge the effect',
    finding: 'From our records we cannot judge whether this affects your results:',
    proposal:
      'What we propose: tell us the tightest tolerance you needed on that work and we will assess it and write to you again. If you prefer, we will re-measure the affected features.',
  },
  pending: {
    subject: 'we are reviewing your measurements',
    finding: 'We are reviewing whether this affects the results we gave you.',
    proposal: 'We will tell you what we find. If a re-measurement is needed we will arrange it with you.',
  },
};

/** The notice for one customer and one group, in plain words: what was found and what the firm proposes. */
export function noticeFor(review: ImpactReviewView, tag: string, group: NoticeGroup, rows: Row[]) {
  const p = proposals[group];
  const jobs = rows.map((r) => `${r.jobReference} (${r.startsOn} to ${r.endsOn})`).join(', ');
  const how = review.trigger === 'calibration' ? 'the calibration laboratory found' : 'one of our own field checks found';
  const error = review.asFound.errorUm === null ? '' : `, with an error of ${um(review.asFound.errorUm)}`;
  return {
    subject: `About measurements taken with our ${tag} (${rows.map((r) => r.jobReference).join(', ')}): ${p.subject}`,
    heading: `A note about your measurements, ${rows[0].customerName}`,
    paragraphs: [
      `On ${review.foundOn} ${how} our ${tag} out of tolerance${error}. We used it on your work ${jobs}.`,
      group === 'pending' ? p.finding : [p.finding, ...rows.map((r) => `• ${comparison(r)}`)].join('\n'),
      p.proposal,
    ],
  };
}
