import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/roles';
import { usersKeys } from './keys';
import type { InvitationView } from '../../../../shared/auth/views';
import type { Page } from '../../../../shared/lists/page';

export const getInvitations = (signal?: AbortSignal) => apiClient.get<Page<InvitationView>>('/invitations', { signal, query: { limit: 500 } });
export const invitationsQueryOptions = () => queryOptions({ queryKey: usersKeys.invitations(), queryFn: ({ signal }) => getInvitations(signal) });
export const useInvitations = () => useQuery(invitationsQueryOptions());

export const inviteUser = (input: { email: string; role: Role }) => apiClient.post<InvitationView>('/invitations', input);
export const resendInvitation = (id: string) => apiClient.post<InvitationView>(`/invitations/${encodeURIComponent(id)}/resend`);
export const withdrawInvitation = (id: string) => apiClient.post<void>(`/invitations/${encodeURIComponent(id)}/withdraw`);

function useInvitationChange<T, R>(fn: (input: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.invitations() }) });
}
export const useInviteUser = () => useInvitationChange(inviteUser);
export const useResendInvitation = () => useInvitationChange(resendInvitation);
export const useWithdrawInvitation = () => useInvitationChange(withdrawInvitation);
