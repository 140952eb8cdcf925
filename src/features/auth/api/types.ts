import type { Role } from '../../../lib/roles';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  organizationId: string;
}

export interface SessionOrganization {
  id: string;
  name: string;
  timeZone: string;
  currency: string;
}

export interface Session {
  user: SessionUser;
  organization: SessionOrganization;
}
