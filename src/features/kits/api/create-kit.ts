import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { KitWithMembersView } from '../../../../shared/assets/views';

/** A kit's name, notes and (replacing the whole list) its members. */
export interface KitInput {
  name: string;
  notes?: string | null;
  memberIds?: string[];
}

export function createKit(input: KitInput): Promise<KitWithMembersView> {
  return apiClient.post<KitWithMembersView>('/kits', input);
}

export function useCreateKit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createKit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitsKeys.all }),
  });
}
