import Handlebars from 'handlebars';
import { convert } from 'html-to-text';
import type { FirmVoice } from '../../shared/formatting/firm-format';
import type { MailTemplate } from './mail-template';

/** Who a mail speaks for: the firm's name and postal address sign it; replies go to its contact when it has one. */
export type FirmSignature = { name: string; address: string; replyTo: string; voice: FirmVoice };

export type RenderedMail = { subject: string; text: string; html: string };

/** Nestkeeper's look: a card under a brass rule on a paper-coloured page. Inline styles, as mail programs keep only those. */
const layout = Handlebars.create().compile<{ lang: string; heading: string; body: string; firm: FirmSignature; addressLines: string[]; note: string }>(
  `<!doctype html><html lang="{{lang}}"><head><meta charset="utf-8"><title>{{heading}}</title></head>
<body style="margin:0;background:#f6f1e7;font-family:Segoe UI,Helvetica,Arial,sans-serif;color:#1c2536;font-size:14px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;padding:24px">
<div style="border-top:4px solid #b08d3c;background:#fff;padding:20px 24px">
<h1 style="font-size:18px;margin:0 0 12px">{{heading}}</h1>
{{{body}}}
<hr style="border:0;border-top:1px solid #e4dccb;margin:16px 0">
<p style="margin:0">{{firm.name}}{{#each addressLines}}<br>{{this}}{{/each}}</p>
</div>
<p style="font-size:12px;color:#5b6475;margin:12px 0 0">{{note}}</p>
</div></body></html>`,
);

/**
 * The plain-text part is the HTML's own words (html-to-text), so the two never say different things. Paragraphs stay
 * one line each: mail programs wrap them to the window (and quoted-printable keeps the lines short on the wire).
 */
export const textOf = (html: string) =>
  convert(html, {
    wordwrap: false,
    selectors: [
      { selector: 'h1', options: { uppercase: false } },
      { selector: 'title', format: 'skip' },
      { selector: 'a', options: { hideLinkHrefIfSameAsText: true } },
      { selector: 'hr', options: { length: 2 } },
      { selector: 'ul', options: { itemPrefix: '• ' } },
    ],
  });

export function renderMail<Data>(template: MailTemplate<Data>, data: Data, firm: FirmSignature): RenderedMail {
  const { subject, heading, body } = template.render(data, firm.voice);
  const note = firm.replyTo
    ? `Sent with Nestkeeper for ${firm.name}. Replies go to ${firm.replyTo}.`
    : `Sent with Nestkeeper for ${firm.name}. This sending address reads no replies; write to ${firm.name} directly.`;
  const addressLines = firm.address
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
  const html = layout({ lang: firm.voice.locale, heading, body, firm, addressLines, note });
  return { subject, text: textOf(html), html };
}
