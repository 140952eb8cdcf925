import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { KitInput, KitView } from './types';

export function createKit(input: KitInput): Promise<KitView> {
  return apiClient.post<KitView>('/kits', input);
}

export function useCreateKit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createKit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitsKeys.all }),
  });
}
