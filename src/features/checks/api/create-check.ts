import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { checksKeys } from './keys';
import type { CheckPayload } from '../../../../shared/schemas/checks';
import type { CheckView } from '../../../../shared/checks/views';

export function createCheck(payload: CheckPayload): Promise<CheckView> {
  return apiClient.post<CheckView>('/checks', payload);
}

/** A failing check holds the item at once, so the fleet, kits and holds read again too. */
export function useCreateCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCheck,
    onSuccess: (check) => {
      queryClient.setQueryData(checksKeys.one(check.id), check);
      return Promise.all([queryClient.invalidateQueries({ queryKey: checksKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
