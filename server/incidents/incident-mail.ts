import { mailTemplate } from '../notifications';

/** To the owner and managers: damage or loss reported, the item on hold. */
export const incidentMail = mailTemplate<{
  asset: { type: string; assetTag: string; serialNumber: string };
  kind: string;
  description: string;
  occurredAt: string;
  location: string | null;
  photos: number;
  damagedBattery: boolean;
}>('incident-reported', {
  subject: '{{asset.assetTag}} reported {{kind}} — now on hold',
  heading: '{{asset.assetTag}}: {{kind}}',
  body: `<p>{{#each (lines description)}}{{#unless @first}}<br>{{/unless}}{{this}}{{/each}}</p>
<p>Reported for {{dateTime occurredAt}}{{#if location}} at {{location}}{{/if}}, {{#if photos}}with {{count photos "photo"}}{{else}}without photos{{/if}}:
{{item asset}}, now on hold. It cannot be booked until it is checked or recalibrated and released.</p>
{{#if damagedBattery}}<p>This is a lithium-ion battery: treat it as damaged. Do not charge it and do not ship it by air; keep it apart in a
fire-safe place and follow local rules and the maker's instructions for disposal.</p>{{/if}}`,
});
