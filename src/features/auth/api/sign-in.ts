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

export function signInWithCode(input: { ticket: string; code: string }): Promise<SignInView> {
  return apiClient.post<SignInView>('/auth/login/code', input);
}

/** Forgets anything cached for a previous person and loads the new session (after sign-in or an accepted invitation). */
export function useStartSession() {
  const queryClient = useQueryClient();
  return async () => {
    queryClient.clear();
    await queryClient.fetchQuery(meQueryOptions());
  };
}

/** The password step; answers a ticket instead when the person signs in with a second step. */
export function useSignIn() {
  const start = useStartSession();
  return useMutation({
    mutationKey: [...authKeys.all, 'sign-in'],
    mutationFn: signIn,
    onSuccess: async (answer) => {
      if ('token' in answer) await start();
    },
  });
}

export function useSignInWithCode() {
  const start = useStartSession();
  return useMutation({ mutationKey: [...authKeys.all, 'sign-in-code'], mutationFn: signInWithCode, onSuccess: start });
}
