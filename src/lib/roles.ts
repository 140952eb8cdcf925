/** The roles → capabilities table shared with the server (shared/auth/roles.ts). */
export { roles, capabilities, capabilitiesByRole, can, roleTitles } from '../../shared/auth/roles';
export type { Role, Capability } from '../../shared/auth/roles';
