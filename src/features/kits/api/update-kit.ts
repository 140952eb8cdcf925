import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient, isApiError } from '../../../lib/api-client';
import type { KitInput } from './create-kit';
import { kitsKeys } from './keys';
import type { KitMemberConflict, KitWithMembersView } from '../../../../shared/assets/views';

export interface UpdateKitInput {
  id: string;
  /** `memberIds` replaces the whole member list. */
  changes: Partial<KitInput>;
}

export function updateKit({ id, changes }: UpdateKitInput): Promise<KitWithMembersView> {
  return apiClient.patch<KitWithMembersView>(`/kits/${encodeURIComponent(id)}`, changes);
}

/** The assets a 409 names as already belonging to another kit. */
export function memberConflicts(error: unknown): KitMemberConflict[] {
  if (!isApiError(error) || error.code !== 'conflict') return [];
  const details = error.details as { conflicts?: unknown } | undefined;
  return Array.isArray(details?.conflicts) ? (details.conflicts as KitMemberConflict[]) : [];
}

export function useUpdateKit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateKit,
    // Membership shows on the fleet list too (its "Kit" column); that feature's
    // lists refetch when next shown (staleTime), so only kits are invalidated here.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitsKeys.all }),
  });
}
