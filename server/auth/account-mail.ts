import { mailTemplate } from '../notifications';

/** Account mail speaks for the firm and always says what to do when the person did not ask for it. */

export const invitationMail = mailTemplate<{ firm: string; inviter: string; roleTitle: string; url: string; expiresAt: Date }>('invitation', {
  subject: '{{inviter}} invited you to {{firm}} on Nestkeeper',
  heading: 'Join {{firm}} on Nestkeeper',
  body: `<p>{{inviter}} has invited you to Nestkeeper, where {{firm}} keeps its fleet, bookings and rentals, as {{roleTitle}}.</p>
<p>Open this link to choose your name and password: <a href="{{url}}">{{url}}</a></p>
<p>The link works once and until {{dateTime expiresAt}} (72 hours after it was sent).</p>
<p>Did not expect this? Ignore this mail: no account is made unless the link is used. If you think it was sent by mistake, tell {{firm}}.</p>`,
});

export const resetMail = mailTemplate<{ firm: string; email: string; url: string; expiresAt: Date }>('password-reset', {
  subject: 'Set a new password for {{firm}} on Nestkeeper',
  heading: 'Set a new password',
  body: `<p>Someone asked to set a new Nestkeeper password for {{email}} at {{firm}}.</p>
<p>Open this link to choose one: <a href="{{url}}">{{url}}</a></p>
<p>The link works once and until {{dateTime expiresAt}} (one hour after it was asked for). Setting a new password signs you out everywhere.</p>
<p>Did not ask for this? Ignore this mail: your password stays as it is. If such mails keep coming, tell your firm's owner.</p>`,
});

export const passwordChangedMail = mailTemplate<{ firm: string; email: string }>('password-changed', {
  subject: 'Your {{firm}} Nestkeeper password was changed',
  heading: 'Your password was changed',
  body: `<p>The Nestkeeper password of {{email}} at {{firm}} was just set anew from a reset link, and every session was signed out.</p>
<p>Was this not you? Ask your firm's owner to disable the account at once, then set a new password from the sign-in page.</p>`,
});
