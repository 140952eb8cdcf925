import type { CheckKind, DecisionRule, Tolerance } from '../../../lib/checks';

export interface OrganizationSettings {
  /** Days before the due date an item counts as "due soon". */
  dueSoonDays: number;
  timeZone: string;
  currency: string;
  name: string;
  /** ILAC-G8 decision rule for field checks (absent from servers before field checks). */
  decisionRule?: DecisionRule;
  /** The firm's tolerance per check kind. */
  tolerances?: Record<CheckKind, Tolerance>;
}
