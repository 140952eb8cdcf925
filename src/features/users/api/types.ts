import type { Role } from '../../../lib/roles';

export interface User {
  id: string;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  createdAt: string;
}

export interface UserList {
  items: User[];
  total: number;
}
