import { mailTemplate } from '../notifications';

/** The daily list to owners and managers of bookings past their last day and not back. */
export const lateReturnsMail = mailTemplate<{
  today: string;
  late: { reference: string | null; startsOn: string; endsOn: string; takenBy: string | null; tags: string }[];
}>('late-returns', {
  subject: '{{count late.length "late return"}} on {{date today}}',
  heading: 'Kit that should be back by now',
  body: `<ul>{{#each late}}<li>{{#if reference}}Job {{reference}}{{else}}Booking{{/if}}, {{dateRange startsOn endsOn}}{{#if takenBy}}, taken by {{takenBy}}{{/if}}: {{tags}}.</li>{{/each}}</ul>
<p>Call whoever has the kit, and extend the booking if it is staying out on purpose.</p>`,
});
