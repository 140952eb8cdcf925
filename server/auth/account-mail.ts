import type { MailContent } from '../notifications';

/** "3 Dec 2026, 04:20 UTC": the voice issue will word dates in the firm's own locale and zone. */
const utc = (at: Date) => `${at.toISOString().slice(0, 10)} ${at.toISOString().slice(11, 16)} UTC`;

/** Account mail speaks for the firm and always says what to do when the person did not ask for it. */
const fromFirm = (firm: string, content: Omit<MailContent, 'footer'>, notYou: string): MailContent => ({
  ...content,
  paragraphs: [...content.paragraphs, notYou],
  footer: `Sent by Nestkeeper on behalf of ${firm}. This address takes no replies.`,
});

export const invitationMail = (m: { firm: string; inviter: string; roleTitle: string; url: string; expiresAt: Date }) =>
  fromFirm(
    m.firm,
    {
      subject: `${m.inviter} invited you to ${m.firm} on Nestkeeper`,
      heading: `Join ${m.firm} on Nestkeeper`,
      paragraphs: [
        `${m.inviter} has invited you to Nestkeeper, where ${m.firm} keeps its fleet, bookings and rentals, as ${m.roleTitle.toLowerCase()}.`,
        `Open this link to choose your name and password: ${m.url}`,
        `The link works once and until ${utc(m.expiresAt)} (72 hours after it was sent).`,
      ],
    },
    `Did not expect this? Ignore this mail: no account is made unless the link is used. If you think it was sent by mistake, tell ${m.firm}.`,
  );

export const resetMail = (m: { firm: string; email: string; url: string; expiresAt: Date }) =>
  fromFirm(
    m.firm,
    {
      subject: `Set a new password for ${m.firm} on Nestkeeper`,
      heading: 'Set a new password',
      paragraphs: [
        `Someone asked to set a new Nestkeeper password for ${m.email} at ${m.firm}.`,
        `Open this link to choose one: ${m.url}`,
        `The link works once and until ${utc(m.expiresAt)} (one hour after it was asked for). Setting a new password signs you out everywhere.`,
      ],
    },
    `Did not ask for this? Ignore this mail: your password stays as it is. If such mails keep coming, tell your firm's owner.`,
  );

export const passwordChangedMail = (m: { firm: string; email: string }) =>
  fromFirm(
    m.firm,
    {
      subject: `Your ${m.firm} Nestkeeper password was changed`,
      heading: 'Your password was changed',
      paragraphs: [`The Nestkeeper password of ${m.email} at ${m.firm} was just set anew from a reset link, and every session was signed out.`],
    },
    `Was this not you? Ask your firm's owner to disable the account at once, then set a new password from the sign-in page.`,
  );
