import { roles, roleTitles } from '../../../lib/roles';

export const roleOptions = roles.map((role) => ({ value: role, label: roleTitles[role] }));
