import type { HoldReason } from '../../../../shared/holds/views';

export const holdReasonWords: Record<HoldReason, string> = {
  incident: 'Damage or loss reported',
  failed_check: 'Failed a field check',
  manual: 'Taken out of service by hand',
};
