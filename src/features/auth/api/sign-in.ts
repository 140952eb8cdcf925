import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { meQueryOptions } from './get-me';
import { authKeys } from './keys';
import type { SignInView } from '../../../../shared/auth/views';

export interface SignInInput {
  email: string;
  password: string;
}

export function signIn(input: SignInInput): Promise<SignInView> {
  return apiClient.post<SignInView>('/auth/login', input);
}

/** Signs in, forgets anything cached for a previous person, and loads the new session. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...authKeys.all, 'sign-in'],
    mutationFn: signIn,
    onSuccess: async () => {
      queryClient.clear();
      await queryClient.fetchQuery(meQueryOptions());
    },
  });
}
