import { describe, expect, it } from 'vitest';
import type { RentalView } from '../../shared/billing/views';
import { handoverMail } from '../../server/rentals/rental-mail';
import { renderMail, type FirmSignature } from '../../server/notifications/mail-layout';
import { letterTemplate } from '../../server/notifications/mail-template';

const firm: FirmSignature = {
  name: 'Harrowgate Survey & Sons',
  address: 'Mill Row 4\n22150 Oakhollow',
  replyTo: 'desk@harrowgate.test',
  voice: { locale: 'en-GB', timeZone: 'Europe/Berlin', currency: 'EUR' },
};

const rental = {
  number: 'R-2026-0042',
  startsOn: '2026-12-07',
  endsOn: '2026-12-11',
  customer: { id: 'c', company: '<b>Quill & Lathe</b> Ltd', billingContact: null, billingEmail: 'accounts@quill.test' },
  items: [
    { id: '1', assetTag: 'TRK-004', type: 'tracker', serialNumber: 'LT-88213', model: null, manufacturer: null, replacementValueMinor: null },
    { id: '2', assetTag: 'SMR-001', type: 'smr', serialNumber: 'S-1', model: null, manufacturer: null, replacementValueMinor: null },
  ],
} as unknown as RentalView;

/** HTML character references as the HTML standard defines them: the few named ones Handlebars writes, and numeric ones. */
const named: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };
const decode = (html: string) =>
  html.replace(/&(#x[0-9a-f]+|#\d+|[a-z]+);/gi, (_, ref: string) =>
    ref[0] === '#' ? String.fromCodePoint(ref[1].toLowerCase() === 'x' ? parseInt(ref.slice(2), 16) : Number(ref.slice(1))) : (named[ref] ?? `&${ref};`),
  );
/** The visible words of an HTML part, read independently of html-to-text: head and tags dropped by pattern, references decoded above. */
const htmlWords = (html: string) => words(decode(html.replace(/<head>[\s\S]*<\/head>/, '').replace(/<[^>]+>/g, ' ')));
const words = (text: string) =>
  text
    .split(/\s+/)
    .map((w) => w.replace(/^[^\p{L}\p{N}<]+|[^\p{L}\p{N}>]+$/gu, ''))
    .filter(Boolean);

describe('mail templates', () => {
  it('give a text part with the same words, in the same order, as the HTML part', () => {
    for (const mail of [
      renderMail(handoverMail, { rental }, firm),
      renderMail(letterTemplate, { subject: 'A note', text: 'Dear Ada,\n\nOne line\nand the next.' }, firm),
    ]) {
      expect(words(mail.text)).toEqual(htmlWords(mail.html));
      expect(words(mail.text).length).toBeGreaterThan(10);
    }
  });

  it('escape HTML in a customer name in the HTML part and keep it as typed in the text part', () => {
    const mail = renderMail(handoverMail, { rental }, firm);
    expect(mail.html).toContain('Dear &lt;b&gt;Quill &amp; Lathe&lt;/b&gt; Ltd,');
    expect(mail.html).not.toContain('<b>Quill');
    expect(mail.text).toContain('Dear <b>Quill & Lathe</b> Ltd,');
    expect(mail.html).toContain('Harrowgate Survey &amp; Sons');
  });

  it('describe items in words, date in the firm’s format and sign with the firm’s name and address', () => {
    const mail = renderMail(handoverMail, { rental }, firm);
    expect(mail.text).toContain('the laser tracker TRK-004, serial LT-88213');
    expect(mail.text).toContain('the SMR SMR-001, serial S-1');
    // en-GB date order per CLDR (from memory): "7–11 Dec 2026"; en-US: "Dec 7 – 11, 2026".
    expect(mail.subject).toBe('Rental R-2026-0042: agreement and calibration certificates');
    expect(mail.text).toMatch(/Your rental R-2026-0042, 7\s?–\s?11 Dec 2026/);
    expect(mail.text).toMatch(/by 11 Dec 2026/);
    expect(mail.text).toMatch(/Harrowgate Survey & Sons\nMill Row 4\n22150 Oakhollow/);
    expect(mail.text).toMatch(/Replies go to\s+desk@harrowgate\.test/);
    const american = renderMail(handoverMail, { rental }, { ...firm, voice: { locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' } });
    expect(american.text).toMatch(/by Dec 11, 2026/);
    expect(american.text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });
});
