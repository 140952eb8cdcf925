import { allowanceWords, type TriageFacts } from '../../shared/calibration/triage';
import type { ImpactBookingView, ImpactReviewView, NoticeGroup } from '../../shared/calibration/views';
import { mailTemplate } from '../notifications';

/** One of the customer's jobs in the notice, with the triage figures that judge it. */
type NoticeJob = {
  reference: string;
  startsOn: string;
  endsOn: string;
  toleranceNote: string | null;
  judged: boolean;
  errorUm: number | null;
  toleranceUm: number | null;
  allowanceUm: number | null;
  distanceM: number | null;
  share: string;
  reason: string;
};

type NoticeData = {
  greeting: string;
  asset: { type: string; assetTag: string; serialNumber: string };
  foundOn: string;
  byCalibration: boolean;
  errorUm: number | null;
  jobs: NoticeJob[];
  references: string;
  pending: boolean;
  words: { subject: string; finding: string; proposal: string };
};

const proposals: Record<NoticeGroup, { subject: string; finding: string; proposal: string }> = {
  no_effect: {
    subject: 'no effect on your results is likely',
    finding: 'We compared that error with the tightest tolerance on record for your work, and it uses only a small share of it:',
    proposal: 'We believe your results stand and no re-measurement is needed. If you would like the figures in more detail, reply to this e-mail.',
  },
  remeasure_offered: {
    subject: 'we propose a re-measurement',
    finding: 'We compared that error with the tightest tolerance on record for your work, and it uses more of it than we accept:',
    proposal:
      'We propose to re-measure the affected features at no cost to you. Please reply with days that suit you and we will book the work; until then, treat the affected results with caution.',
  },
  customer_notified: {
    subject: 'we need your tolerance to judge the effect',
    finding: 'From our records we cannot judge whether this affects your results:',
    proposal:
      'Please tell us the tightest tolerance you needed on that work and we will assess it and write to you again. If you prefer, we will re-measure the affected features.',
  },
  pending: {
    subject: 'we are reviewing your measurements',
    finding: 'We are reviewing whether this affects the results we gave you.',
    proposal: 'We will tell you what we find. If a re-measurement is needed we will arrange it with you.',
  },
};

/** The customer notice as a letter: what was found, on which of their jobs, what it means and what the firm will do. */
const impactNotice = mailTemplate<NoticeData>('impact-notice', {
  subject: 'Measurements taken with our {{typeName asset.type}} {{asset.assetTag}} ({{references}}): {{words.subject}}',
  heading: 'A note about your measurements',
  body: `<p>{{greeting}}</p>
<p>On {{date foundOn}} {{#if byCalibration}}the calibration laboratory found{{else}}one of our own field checks found{{/if}} that {{item asset}},
was out of tolerance{{#if errorUm}}, with an error of {{um errorUm}}{{/if}}. We used it on your {{plural jobs.length "job"}}:</p>
<ul>{{#each jobs}}<li>{{reference}}, {{dateRange startsOn endsOn}}</li>{{/each}}</ul>
{{#if pending}}<p>{{words.finding}}</p>{{else}}<p>{{words.finding}}</p><ul>{{#each jobs}}<li>{{> comparison}}</li>{{/each}}</ul>{{/if}}
<p>{{words.proposal}}</p>
<p>We are sorry for the trouble.</p>
<p>Kind regards,</p>`,
  partials: {
    comparison: `{{reference}}{{#if toleranceNote}} ({{toleranceNote}}){{/if}}: {{#if judged}}an error of {{um errorUm}} against your tolerance of
{{um toleranceUm}}{{#if distanceM}} at {{distanceM}} m{{/if}}; up to {{um allowanceUm}} would be {{share}} of it.{{else}}{{reason}}{{/if}}`,
  },
});

type Row = ImpactBookingView & { jobReference: string };
const triageOf = (b: ImpactBookingView): TriageFacts => b.triage ?? b.suggestion;

function noticeJob(b: Row): NoticeJob {
  const t = triageOf(b);
  return {
    reference: b.jobReference,
    startsOn: b.startsOn,
    endsOn: b.endsOn,
    toleranceNote: t.toleranceNote,
    judged: t.toleranceUm !== null && t.allowanceUm !== null && t.asFoundErrorUm !== null,
    errorUm: t.asFoundErrorUm,
    toleranceUm: t.toleranceUm,
    allowanceUm: t.allowanceUm,
    distanceM: t.tolerance?.kind === 'range' ? t.distanceM : null,
    share: allowanceWords(t.ratio),
    reason: t.reason,
  };
}

/** The template and data of the notice for one customer and one group. */
export function noticeFor(review: ImpactReviewView, asset: NoticeData['asset'], group: NoticeGroup, rows: Row[]) {
  const who = rows[0].contactName ?? rows[0].customerName;
  const data: NoticeData = {
    greeting: who ? `Dear ${who},` : 'Dear customer,',
    asset,
    foundOn: review.foundOn,
    byCalibration: review.trigger === 'calibration',
    errorUm: review.asFound.errorUm,
    jobs: rows.map(noticeJob),
    references: new Intl.ListFormat('en', { type: 'conjunction' }).format(rows.map((r) => r.jobReference)),
    pending: group === 'pending',
    words: proposals[group],
  };
  return { template: impactNotice, data };
}
