import { useMutation, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import type { ResetLinkView, ResetRequestedView } from '../../../../shared/auth/views';

export const requestPasswordReset = (email: string) => apiClient.post<ResetRequestedView>('/auth/password-reset', { email });
export const lookUpResetLink = (token: string) => apiClient.post<ResetLinkView>('/auth/password-reset/lookup', { token });
export const completePasswordReset = (input: { token: string; password: string }) => apiClient.post<void>('/auth/password-reset/complete', input);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });

/** What the reset link opens; no retries: a used or expired link will not get better. */
export const useResetLink = (token: string) =>
  useQuery({ queryKey: [...authKeys.all, 'reset-link', token], queryFn: () => lookUpResetLink(token), retry: false, enabled: token !== '' });

export const useCompletePasswordReset = () => useMutation({ mutationFn: completePasswordReset });
