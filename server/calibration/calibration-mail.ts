import { mailTemplate } from '../notifications';

type DueLine = { assetTag: string; type: string; dueOn: string | null; threatened: { jobReference: string | null; startsOn: string; endsOn: string }[] };

/** The daily digest to owners and managers: items newly overdue or due soon, and the bookings they threaten. */
export const dueDigestMail = mailTemplate<{
  today: string;
  overdue: DueLine[];
  overdueMore: number;
  soon: DueLine[];
  soonMore: number;
  overdueCount: number;
  soonCount: number;
  withinDays: number;
  soonBy: string;
}>('due-digest', {
  subject: 'Calibration: {{overdueCount}} newly overdue, {{soonCount}} newly due soon ({{date today}})',
  heading: 'Calibration changes since the last scan',
  body: `{{#if overdue.length}}<p>Overdue now:</p><ul>{{#each overdue}}<li>{{> dueLine}}</li>{{/each}}</ul>{{/if}}
{{#if overdueMore}}<p>…and {{overdueMore}} more overdue.</p>{{/if}}
{{#if soon.length}}<p>Due within {{count withinDays "day"}} (by {{date soonBy}}):</p><ul>{{#each soon}}<li>{{> dueLine}}</li>{{/each}}</ul>{{/if}}
{{#if soonMore}}<p>…and {{soonMore}} more due soon.</p>{{/if}}
<p>Plan lab trips from the review page; the window finder shows when each item can go without breaking a booking.</p>`,
  partials: {
    dueLine: `{{assetTag}} ({{typeName type}}) — {{#if dueOn}}due {{date dueOn}}{{else}}no calibration on record{{/if}}{{#if threatened.length}};
threatens {{#each threatened}}{{#unless @first}}, {{/unless}}{{#if jobReference}}job {{jobReference}}{{else}}a booking{{/if}} {{dateRange startsOn endsOn}}{{/each}}{{/if}}`,
  },
});

/** To the owner: an item was found out of tolerance and a review opened. */
export const impactOpenedMail = mailTemplate<{
  asset: { type: string; assetTag: string; serialNumber: string };
  foundOn: string;
  byCalibration: boolean;
  since: string | null;
  bookings: number;
}>('impact-opened', {
  subject: 'Impact review opened for {{asset.assetTag}}: {{count bookings "booking"}} to assess',
  heading: '{{asset.assetTag}} was found out of tolerance',
  body: `<p>On {{date foundOn}}, {{item asset}} was found out of tolerance ({{#if byCalibration}}as-found calibration result{{else}}failed field check{{/if}}).
Its last passing evidence is {{#if since}}from {{date since}}{{else}}not on record{{/if}}.</p>
<p>{{count bookings "booking"}} used it in between. Assess each one and tell the customers concerned (ISO 9001:2015 §7.1.5.2).</p>`,
});
