/** What the sign-in API answers. Plain types, no zod: the browser imports them as types only. */
import type { UserView } from '../users/views';

/** `GET /api/auth/me`: who is signed in, and the firm whose time zone and currency the screens use. */
export type SessionView = {
  user: UserView;
  organization: { id: string; name: string; timeZone: string; currency: string };
};

/** `POST /api/auth/login` (the session cookie is set too). */
export type SignInView = { token: string; user: UserView };
