import Handlebars from 'handlebars';
import { itemInWords, typeInSentence } from '../../shared/assets/item-words';
import { firmFormat, type FirmVoice } from '../../shared/formatting/firm-format';

/**
 * One template per kind of mail. The body is a Handlebars HTML fragment (HTML-escaped by default); subject and heading
 * are plain-text templates. Dates, money and counts go through the firm's format with the helpers below, so a template
 * never prints an ISO date. The layout (mail-layout.ts) adds the card, the signature and the plain-text part.
 */
export type MailTemplate<Data> = { kind: string; render: (data: Data, voice: FirmVoice) => { subject: string; heading: string; body: string } };

const engine = Handlebars.create();

/** Handlebars passes its options object after a helper's own arguments. */
const own = (args: unknown[]) => args.slice(0, -1);

/** The word for `n` things in English, the language of the mails: one, else the plural given or one + s. */
const englishPlural = new Intl.PluralRules('en');
function pluralWord([n, one, many]: unknown[]) {
  return englishPlural.select(n as number) === 'one' ? (one as string) : typeof many === 'string' ? many : `${one as string}s`;
}

/** `{{item this}}`: "the laser tracker TRK-004, serial LT-88213". */
engine.registerHelper('item', (item: { type: string; assetTag: string; serialNumber?: string | null }) => itemInWords(item));
/** `{{typeName type}}`: "laser tracker", "SMR". */
engine.registerHelper('typeName', (type: string) => typeInSentence(type));
/** A paragraph typed by a person: its lines, for `<br>` between them. */
engine.registerHelper('lines', (text: string) => text.split(/\r?\n/));
/** A letter typed by a person: its paragraphs, split on blank lines. */
engine.registerHelper('paragraphsOf', (text: string) =>
  text
    .split(/\r?\n\s*\r?\n/)
    .map((p) => p.trim())
    .filter(Boolean),
);

/** The helpers bound to the firm's voice. A mail's reader has no known zone, so its times always name the firm's zone. */
function helpersFor(voice: FirmVoice): Handlebars.RuntimeOptions['helpers'] {
  const fmt = firmFormat(voice);
  return {
    date: (value: string | Date) => fmt.date(value),
    dateRange: (first: string, last: string) => fmt.dateRange(first, last),
    dateTime: (value: string | Date) => fmt.dateTime(value),
    um: (value: number) => fmt.um(value),
    /** `{{money minor}}` in the firm's currency, `{{money minor "USD"}}` in another. */
    money: (...args: unknown[]) => {
      const [minor, currency] = own(args);
      return fmt.money(minor as number, typeof currency === 'string' ? currency : undefined);
    },
    /** `{{plural n "job"}}` → "job" or "jobs", for a sentence that names the things after. */
    plural: (...args: unknown[]) => pluralWord(own(args)),
    /** `{{count n "booking"}}` → "1 booking", "3 bookings"; `{{count n "battery" "batteries"}}` for other plurals. */
    count: (...args: unknown[]) => `${fmt.count(own(args)[0] as number)} ${pluralWord(own(args))}`,
  };
}

/** `partials`: pieces the body repeats (`{{> name}}`), such as one line of a list. */
export function mailTemplate<Data>(
  kind: string,
  source: { subject: string; heading: string; body: string; partials?: Record<string, string> },
): MailTemplate<Data> {
  const partials = Object.fromEntries(Object.entries(source.partials ?? {}).map(([name, text]) => [name, engine.compile(text)]));
  const subject = engine.compile<Data>(source.subject, { noEscape: true, strict: true });
  const heading = engine.compile<Data>(source.heading, { noEscape: true, strict: true });
  const body = engine.compile<Data>(source.body);
  const oneLine = (s: string) => s.replace(/\s+/g, ' ').trim();
  return {
    kind,
    render(data, voice) {
      const helpers = helpersFor(voice);
      return { subject: oneLine(subject(data, { helpers })), heading: oneLine(heading(data, { helpers })), body: body(data, { helpers, partials }) };
    },
  };
}

/** A letter as a person wrote or edited it (a customer notice): its subject is its heading; paragraphs and lines are kept. */
export const letterTemplate = mailTemplate<{ subject: string; text: string }>('letter', {
  subject: '{{subject}}',
  heading: '{{subject}}',
  body: '{{#each (paragraphsOf text)}}<p>{{#each (lines this)}}{{#unless @first}}<br>{{/unless}}{{this}}{{/each}}</p>{{/each}}',
});
