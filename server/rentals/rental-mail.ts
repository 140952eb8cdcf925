import type { RentalView } from '../../shared/billing/views';
import { mailTemplate } from '../notifications';

/** To the renter when the kit is handed over: the papers attached, what was handed over, when it is due back, and care. */
export const handoverMail = mailTemplate<{ rental: RentalView }>('rental-handover', {
  subject: 'Rental {{rental.number}}: agreement and calibration certificates',
  heading: 'Your rental {{rental.number}}, {{dateRange rental.startsOn rental.endsOn}}',
  body: `<p>{{#if rental.customer.billingContact}}Dear {{rental.customer.billingContact}},{{else}}Dear {{rental.customer.company}},{{/if}}</p>
<p>The kit for rental {{rental.number}} was handed over today. Attached are the rental agreement and a certificate pack with the current
calibration certificate of every rented item that needs one, for your own auditors.</p>
<p>You have {{count rental.items.length "item"}} from us:</p>
<ul>{{#each rental.items}}<li>{{item this}}</li>{{/each}}</ul>
<p>Please bring everything back by {{date rental.endsOn}}. If you need the kit longer, tell us before then and we will extend the rental if it is free.</p>
<p>Laser trackers emit a laser beam: do not stare into it. Damaged lithium-ion batteries are a fire risk: do not charge or fly them.
Cases are heavy. Follow local codes, the carrier's rules and the instrument maker's instructions.</p>`,
});
