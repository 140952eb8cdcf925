import { mailTemplate } from '../notifications';

/** To the owner and managers: a failed field check put the item on hold. */
export const failedCheckMail = mailTemplate<{
  asset: { type: string; assetTag: string; serialNumber: string };
  kind: string;
  what: string;
  performedAt: Date;
  arrivedAt: Date | null;
}>('check-failed', {
  subject: '{{asset.assetTag}} is on hold: {{kind}} failed',
  heading: '{{asset.assetTag}} failed a field check and is on hold',
  body: `<p>{{what}}.</p>
{{#if arrivedAt}}<p>The check was done at {{dateTime performedAt}} and reached Nestkeeper at {{dateTime arrivedAt}} (recorded without signal).</p>{{/if}}
<p>Until it is recalibrated or passes the check again and someone releases it, {{item asset}} cannot be booked or checked out.
Jobs it measured since its last good check may need a look.</p>`,
});
