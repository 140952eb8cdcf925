import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RenterRentalView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { rentalsKeys } from './keys';

export type AgreementAcceptance = { fullName: string; agreed: boolean; agreementSha256: string };

/** The renter accepts the agreement they were shown (409 when it changed meanwhile: read it again). */
export function acceptAgreement({ token, ...body }: AgreementAcceptance & { token: string }): Promise<RenterRentalView> {
  return apiClient.post<RenterRentalView>(`/renter/${encodeURIComponent(token)}/agreement`, body);
}

export function useAcceptAgreement() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptAgreement,
    onSuccess: (view, { token }) => queryClient.setQueryData(rentalsKeys.renter(token), view),
    onError: (_error, { token }) => queryClient.invalidateQueries({ queryKey: rentalsKeys.renter(token) }),
  });
}
