/** What the sign-in and account API answers. Plain types, no zod: the browser imports them as types only. */
import type { Role } from './roles';
import type { UserView } from '../users/views';

/** Where a person stands with the second step (TOTP). `owed`: the firm requires it of their role and it is not on yet,
 * so the server answers nothing else until it is set up. */
export type SecondStepState = { on: boolean; requiredForRole: boolean; owed: boolean; recoveryCodesLeft: number };

/** `GET /api/auth/me`: who is signed in, and the firm whose time zone and currency the screens use. */
export type SessionView = {
  user: UserView;
  organization: { id: string; name: string; locale: string; timeZone: string; currency: string };
  secondStep: SecondStepState;
};

/** `GET /api/auth/session`: how the client starts; `null` when nobody is signed in (or the session has ended). */
export type SessionProbeView = { session: SessionView | null };

/** `POST /api/auth/login` and the code step: a session (the cookie is set too), or — for a person with a second step —
 * a short-lived ticket to send back with the code. */
export type SignInView = { token: string; user: UserView } | { secondStep: { ticket: string; expiresAt: string } };

/** One place a person is signed in (`GET /api/account/sessions`). */
export type AccountSessionView = { id: string; device: string; signedInAt: string; lastSeenAt: string; current: boolean };

/** `POST /api/account/second-step/start`: the secret to put in an authenticator app, as text and as a QR code. */
export type SecondStepEnrolmentView = { secret: string; uri: string; qrDataUrl: string };

/** `POST /api/account/second-step/confirm`: the ten recovery codes, shown once. */
export type RecoveryCodesView = { recoveryCodes: string[] };

/** An invitation as the owner sees it. `state` is worked out from its dates. */
export type InvitationView = {
  id: string;
  email: string;
  role: Role;
  state: 'pending' | 'expired';
  sentAt: string;
  expiresAt: string;
  invitedBy: string | null;
};

/** What a mailed link opens, before the person acts on it. */
export type InvitationLinkView = { email: string; role: Role; firmName: string; expiresAt: string };
export type ResetLinkView = { email: string; expiresAt: string };

/** The same words for every address (`POST /api/auth/password-reset`). */
export type ResetRequestedView = { message: string };
