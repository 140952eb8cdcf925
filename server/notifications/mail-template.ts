/** Nestkeeper's e-mails: a plain-text body for every reader and a simple HTML
 * twin with the same words. Short, specific, signed by the product. */
export type MailContent = { subject: string; heading: string; paragraphs: string[]; footer?: string };

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function renderMail(content: MailContent): { subject: string; text: string; html: string } {
  const footer = content.footer ?? 'Sent by Nestkeeper for your firm. Reply to your shop manager, not to this address.';
  const text = [content.heading, '', ...content.paragraphs.flatMap((p) => [p, '']), '—', footer].join('\n');
  const html = `<!doctype html><html><body style="margin:0;background:#f6f1e7;font-family:Segoe UI,Helvetica,Arial,sans-serif;color:#1c2536">
<div style="max-width:560px;margin:0 auto;padding:24px">
<div style="border-top:4px solid #b08d3c;background:#fff;padding:20px 24px">
<h1 style="font-size:18px;margin:0 0 12px">${escapeHtml(content.heading)}</h1>
${content.paragraphs.map((p) => `<p style="font-size:14px;line-height:1.5;margin:0 0 10px">${escapeHtml(p)}</p>`).join('\n')}
</div>
<p style="font-size:12px;color:#5b6475;margin:12px 0 0">${escapeHtml(footer)}</p>
</div></body></html>`;
  return { subject: content.subject, text, html };
}
