import type { InvoiceView } from '../../shared/billing/views';
import { mailTemplate } from '../notifications';

type Rental = { number: string; currency: string };

/** To billing and the owner: the nightly renewal of a card authorization was refused. */
export const renewalRefusedMail = mailTemplate<{ rental: Rental; amountMinor: number; lapsesAt: Date | null; message: string }>('deposit-renewal-refused', {
  subject: 'Deposit authorization not renewed: rental {{rental.number}}',
  heading: 'The card refused to renew the deposit authorization for rental {{rental.number}}',
  body: `<p>The authorization of {{money amountMinor rental.currency}} lapses {{#if lapsesAt}}at {{dateTime lapsesAt}}{{else}}at a time the provider did not say{{/if}};
renewing it on the saved card failed: {{message}}</p>
<p>Ask the customer for another card, or settle the rental before the authorization lapses.</p>`,
});

/** To billing and the owner: the provider let a card authorization go. */
export const authorizationLapsedMail = mailTemplate<{ rental: Rental; reason: string | null }>('deposit-lapsed', {
  subject: 'Deposit authorization lapsed: rental {{rental.number}}',
  heading: 'The card authorization for rental {{rental.number}} has lapsed',
  body: `<p>The provider released the authorization ({{#if reason}}{{reason}}{{else}}no reason given{{/if}}). Nothing is secured on the card any more.</p>
<p>Charges at return can still go on the saved card, or on the invoice.</p>`,
});

/** To the renter: accept the agreement and authorize the deposit on the rental's page. */
export const depositRequestMail = mailTemplate<{
  rental: Rental & { startsOn: string; endsOn: string; depositMinor: number };
  customer: { company: string; billingContact: string | null };
  renterUrl: string;
  linkDays: number;
}>('deposit-request', {
  subject: 'Rental {{rental.number}}: your agreement and deposit',
  heading: 'Rental {{rental.number}}, {{dateRange rental.startsOn rental.endsOn}}',
  body: `<p>Dear {{#if customer.billingContact}}{{customer.billingContact}}{{else}}{{customer.company}}{{/if}},</p>
<p>before the kit is handed over on {{date rental.startsOn}}, please read and accept the rental agreement and place the deposit of
{{money rental.depositMinor rental.currency}} on your card. It is an authorization, not a charge.</p>
<p>Your rental's page (no sign-in needed; valid {{count linkDays "day"}}): <a href="{{renterUrl}}">{{renterUrl}}</a></p>
<p>The card is typed on the payment provider's own page; its details never reach us. The page also lists every item with its calibration
valid-through date and the certificate pack.</p>`,
});

/** To the customer's accounts: the invoice or credit note, its PDF attached. */
export const invoiceMail = mailTemplate<{ invoice: InvoiceView; isInvoice: boolean; firm: string; paymentTerms: string }>('invoice', {
  subject: '{{#if isInvoice}}Invoice{{else}}Credit note{{/if}} {{invoice.number}} from {{firm}}',
  heading: '{{#if isInvoice}}Invoice{{else}}Credit note{{/if}} {{invoice.number}}',
  body: `<p>Dear {{#if invoice.customer.billingContact}}{{invoice.customer.billingContact}}{{else}}{{invoice.customer.company}}{{/if}},</p>
<p>please find {{#if isInvoice}}our invoice{{else}}our credit note{{/if}} {{invoice.number}} of {{date invoice.issuedOn}} for rental {{invoice.rental.number}}
({{dateRange invoice.rental.startsOn invoice.rental.endsOn}}) attached: {{money invoice.totalMinor invoice.currency}}.</p>
{{#if isInvoice}}<p>{{#if invoice.balanceMinor}}Balance due: {{money invoice.balanceMinor invoice.currency}}{{#if invoice.dueOn}}, by {{date invoice.dueOn}}{{/if}}.{{else}}Nothing is left to pay.{{/if}}</p>
{{#if paymentTerms}}<p>{{paymentTerms}}</p>{{/if}}
{{else}}<p>It corrects invoice {{invoice.correctsNumber}}{{#if invoice.corrects}} of {{date invoice.corrects.issuedOn}}{{/if}}: {{invoice.reason}}</p>{{/if}}`,
});

/** To the customer's accounts: what was taken from the card and what was let go, once the deposit is settled. */
export const depositSettledMail = mailTemplate<{
  rental: Rental;
  customer: { company: string; billingContact: string | null };
  capturedMinor: number;
  chargedMinor: number;
  releasedMinor: number;
  takenMinor: number;
  reason: string | null;
}>('deposit-settled', {
  subject: 'Rental {{rental.number}}: deposit {{#if takenMinor}}{{money takenMinor rental.currency}} taken{{else}}released{{/if}}',
  heading: 'Deposit for rental {{rental.number}}',
  body: `<p>Dear {{#if customer.billingContact}}{{customer.billingContact}}{{else}}{{customer.company}}{{/if}},</p>
<p>the kit of rental {{rental.number}} is back with us and its deposit is settled.</p>
{{#if capturedMinor}}<p>We have taken {{money capturedMinor rental.currency}} from the card authorization{{#if reason}} for: {{reason}}{{/if}}.</p>{{/if}}
{{#if chargedMinor}}<p>A further {{money chargedMinor rental.currency}} was charged to the card you saved with us{{#if reason}}{{#unless capturedMinor}} for: {{reason}}{{/unless}}{{/if}}.</p>{{/if}}
{{#if releasedMinor}}<p>{{#if takenMinor}}The other{{else}}The whole authorization of{{/if}} {{money releasedMinor rental.currency}} is released; your card issuer decides how soon it shows on your statement.</p>{{/if}}
<p>The invoice follows in a separate mail and shows these amounts as paid.</p>`,
});
