/** What the users API answers. Plain types, no zod: the browser imports them as types only. */
import type { Role } from '../auth/roles';

/** A person of the firm as the API shows them (never the password). */
export type UserView = {
  id: string;
  email: string;
  name: string;
  role: Role;
  organizationId: string;
  disabled: boolean;
  /** Signs in with a second step (TOTP). */
  secondStepOn: boolean;
  createdAt: string;
};

/** `GET /api/users/staff`: the firm's active people by name and role, for "Lead technician" and "Taken by" lists. */
export type StaffMemberView = { id: string; name: string; role: Role };
