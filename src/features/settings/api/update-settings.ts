import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { settingsKeys } from './keys';
import type { CheckKind, DecisionRule, Tolerance } from '../../../lib/checks';
import type { IntervalPolicy } from '../../../../shared/calibration/interval-review';
import type { CalibrationProvider, DepositPolicy, InvoiceIssuer, OrganizationSettingsView } from '../../../../shared/organizations/views';

export interface UpdateSettingsInput {
  dueSoonDays?: number;
  /** Days before a booking starts that its checkout opens. */
  checkoutOpensDaysBefore?: number;
  timeZone?: string;
  /** One of firmLocales: how dates, numbers and money are written everywhere. */
  locale?: string;
  decisionRule?: DecisionRule;
  /** Impact triage ratio n (n:1), 1 to 20. */
  triageRatio?: number;
  tolerances?: Partial<Record<CheckKind, Tolerance>>;
  /** The whole list; it replaces the saved one. */
  providers?: CalibrationProvider[];
  /** The whole policy; it replaces the saved one. */
  intervalPolicy?: IntervalPolicy;
  /** Tax on rentals in basis points (19 % = 1900). */
  taxRateBasisPoints?: number;
  depositPolicy?: DepositPolicy;
  issuer?: InvoiceIssuer;
  /** Owners and billing clerks must sign in with a second step. */
  secondStepRequired?: boolean;
  /** Where replies to the firm's mail go ('' for none). */
  mailReplyTo?: string;
}

export function updateSettings(input: UpdateSettingsInput): Promise<OrganizationSettingsView> {
  return apiClient.patch<OrganizationSettingsView>('/settings', input);
}

/** Everything else that shows dates or due states reads the session and lists again. */
export function useUpdateSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (settings) => {
      queryClient.setQueryData(settingsKeys.current(), settings);
      return queryClient.invalidateQueries();
    },
  });
}
