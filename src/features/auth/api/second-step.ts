import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import type { RecoveryCodesView, SecondStepEnrolmentView } from '../../../../shared/auth/views';

export const startSecondStep = () => apiClient.post<SecondStepEnrolmentView>('/account/second-step/start');
export const confirmSecondStep = (code: string) => apiClient.post<RecoveryCodesView>('/account/second-step/confirm', { code });
export const turnOffSecondStep = (password: string) => apiClient.post<void>('/account/second-step/off', { password });

export const useStartSecondStep = () => useMutation({ mutationFn: startSecondStep });

/** Reads the session again (and with it whether the app may open); after confirming, only once the recovery codes were seen. */
export function useRefreshSession() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: authKeys.me() });
}
export const useConfirmSecondStep = () => useMutation({ mutationFn: confirmSecondStep });
export function useTurnOffSecondStep() {
  const refresh = useRefreshSession();
  return useMutation({ mutationFn: turnOffSecondStep, onSuccess: refresh });
}
