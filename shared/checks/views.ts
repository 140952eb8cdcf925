/** What the field-checks API answers. Plain types, no zod: the browser imports them as types only. */
import type { TipPosition } from '../assets/vocabulary';
import type { Decision, DecisionRule } from './decision';
import type { DriftForecast } from './drift-forecast';
import type { Point } from './geometry';
import type { Tolerance } from './tolerance';

/** How the decision was reached, stored with every check (µm). */
export type CheckDecisionFields = {
  toleranceUm: number;
  guardBandUm: number;
  expandedUncertaintyUm: number;
  decisionRule: DecisionRule;
  decision: Decision;
};

/** What each kind reports besides the decision (µm unless named mm). */
export type TipValidationResult = { deviationsUm: number[]; meanOffsetUm: number; spreadUm: number; maxDeviationUm: number };
export type TwoFaceResult = { errorUm: number };
export type LengthCheckResult = { measuredMm: number; expectedMm: number; errorUm: number };

type CheckBase = {
  id: string;
  assetId: string;
  relatedAssetId: string | null;
  /** When the check was done (on the phone, perhaps without signal). */
  performedAt: string;
  /** When it reached the server. */
  recordedAt: string;
  performedBy: string;
  note: string | null;
};

type CommonInputs = { distanceM: number | null; tolerance: Tolerance; uncertaintyComponentsUm: number[] | null };

/** A field check as recorded: its inputs, the computed result and the decision. */
export type CheckView =
  | (CheckBase & {
      kind: 'tip_validation';
      position: TipPosition;
      inputs: CommonInputs & { reference: Point; readings: Point[] };
      result: TipValidationResult & CheckDecisionFields;
    })
  | (CheckBase & {
      kind: 'two_face';
      position: null;
      inputs: CommonInputs & { front: Point; back: Point };
      result: TwoFaceResult & CheckDecisionFields;
    })
  | (CheckBase & {
      kind: 'length_check';
      position: null;
      inputs: CommonInputs & {
        endA: Point;
        endB: Point;
        temperatureC: number;
        scaleBar: { assetTag: string; certifiedLengthMm: number; expansionPpmPerK: number };
      };
      result: LengthCheckResult & CheckDecisionFields;
    });

export type TipValidationState = 'validated' | 'not_validated' | 'failed';

/** `GET /api/assets/:id/tip-validation`: validated only where the latest validation in that position passed. */
export type TipValidationStatus = {
  positions: { position: TipPosition; state: TipValidationState; lastCheckId: string | null; lastPerformedAt: string | null }[];
};

/**
 * `GET /api/checks/to-do`: a tip position in kit I carry now or next whose latest validation did not pass (or never
 * happened), or that passed but is forecast to reach its limit within the due-soon window (`forecastOn`).
 */
export type CheckToDo = {
  reason: 'not_validated' | 'forecast';
  /** The forecast day it reaches its limit (null: not a forecast item, or already past). */
  forecastOn: string | null;
  assetId: string;
  assetTag: string;
  position: TipPosition;
  lastDecision: Decision | null;
  lastCheckedAt: string | null;
  bookingId: string;
  startsOn: string;
  bookingState: 'out' | 'reserved';
};

/** A tip position's drift forecast; `failsSoon` when it reaches its limit within the firm's due-soon window (or is past it). Advice only. */
export type TipForecastView = { assetId: string; assetTag: string; position: TipPosition; forecast: DriftForecast; failsSoon: boolean };

/** `GET /api/assets/:id/tip-forecast` and `GET /api/checks/forecasts`: forecasts, with the window they were judged against. */
export type TipForecastsView = { items: TipForecastView[]; total: number; dueSoonDays: number; until: string };
