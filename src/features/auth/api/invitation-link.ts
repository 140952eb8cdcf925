import { useMutation, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import { useStartSession } from './sign-in';
import type { InvitationLinkView, SignInView } from '../../../../shared/auth/views';

export const lookUpInvitation = (token: string) => apiClient.post<InvitationLinkView>('/invitations/lookup', { token });
export const acceptInvitation = (input: { token: string; name: string; password: string }) => apiClient.post<SignInView>('/invitations/accept', input);

export const useInvitationLink = (token: string) =>
  useQuery({ queryKey: [...authKeys.all, 'invitation', token], queryFn: () => lookUpInvitation(token), retry: false, enabled: token !== '' });

/** Accepting signs the new person in. */
export function useAcceptInvitation() {
  const start = useStartSession();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: start });
}
