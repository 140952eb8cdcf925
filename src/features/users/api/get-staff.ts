import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../../shared/auth/roles';
import type { Page } from '../../../../shared/lists/page';
import type { StaffMemberView } from '../../../../shared/users/views';
import { usersKeys } from './keys';

/** GET /api/users/staff?role= — the firm's active people in these roles, by name (anyone who books may ask). */
export function getStaff(roles: Role[], signal?: AbortSignal): Promise<Page<StaffMemberView>> {
  return apiClient.get<Page<StaffMemberView>>(`/users/staff?role=${encodeURIComponent(roles.join(','))}`, { signal });
}

export const staffQueryOptions = (roles: Role[]) =>
  queryOptions({ queryKey: usersKeys.staff(roles), queryFn: ({ signal }) => getStaff(roles, signal), staleTime: 60_000 });

export function useStaff(roles: Role[]) {
  return useQuery(staffQueryOptions(roles));
}
