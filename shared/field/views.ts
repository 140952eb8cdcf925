/** What the technician's phone keeps for work without signal (`GET /api/field/copy`). Plain types: the browser imports them as types only. */
import type { AssetView } from '../assets/views';
import type { MyKitView } from '../bookings/views';
import type { Decision, DecisionRule } from '../checks/decision';
import type { Tolerance } from '../checks/tolerance';
import type { CheckKind } from '../schemas/check-kinds';
import type { TipPosition } from '../assets/vocabulary';

/** A tip position's latest validation, as the booking rules and the hold release read it. */
export type FieldTipValidation = {
  assetId: string;
  position: TipPosition;
  checkId: string;
  decision: Decision;
  performedAt: string;
  maxDeviationUm: number | null;
  toleranceUm: number;
};

/**
 * The field copy: the kit the signed-in person carries now and next with every item, each tip position's latest
 * validation, and the firm's check tolerances and decision rule. Nothing else of the firm's data.
 */
export type FieldCopyView = {
  /** When the server made this copy; the phone says how old it is. */
  madeAt: string;
  bookings: MyKitView;
  /** Every item of those bookings, by asset tag. */
  items: AssetView[];
  tipValidations: FieldTipValidation[];
  checkRules: { decisionRule: DecisionRule; tolerances: Record<CheckKind, Tolerance> };
};
