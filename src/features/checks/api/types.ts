import type { CheckKind, Decision, DecisionRule, Point, Tolerance } from '../../../lib/checks';
import type { TipPosition } from '../../../lib/assets';

export type { CheckKind, Decision, DecisionRule, Point, Tolerance } from '../../../lib/checks';

/** What each kind reports besides the decision (µm unless named mm). */
export interface TipValidationResult {
  deviationsUm: number[];
  meanOffsetUm: number;
  spreadUm: number;
  maxDeviationUm: number;
}
export interface TwoFaceResult {
  errorUm: number;
}
export interface LengthCheckResult {
  measuredMm: number;
  expectedMm: number;
  errorUm: number;
}

export interface CheckDecisionFields {
  toleranceUm: number;
  guardBandUm: number;
  expandedUncertaintyUm: number;
  decisionRule: DecisionRule;
  decision: Decision;
}

interface CheckBase {
  id: string;
  assetId: string;
  relatedAssetId: string | null;
  performedAt: string;
  performedBy: string;
  note: string | null;
}

interface CommonInputs {
  distanceM: number | null;
  tolerance: Tolerance;
  uncertaintyComponentsUm: number[] | null;
}

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

export interface CheckPage {
  items: CheckView[];
  total: number;
}

export interface CheckListParams {
  assetId?: string;
  kind?: CheckKind;
  limit: number;
  offset: number;
}

interface CommonPayload {
  assetId: string;
  distanceM?: number | null;
  toleranceUm?: number | null;
  uncertaintyUm?: number | null;
  uncertaintyComponentsUm?: number[];
  performedAt?: string;
  note?: string | null;
}

export type CheckPayload =
  | (CommonPayload & {
      kind: 'tip_validation';
      probeId?: string | null;
      position: TipPosition;
      reference: Point;
      readings: Point[];
    })
  | (CommonPayload & { kind: 'two_face'; front: Point; back: Point })
  | (CommonPayload & { kind: 'length_check'; scaleBarId: string; endA: Point; endB: Point; temperatureC: number });

export type TipValidationState = 'validated' | 'not_validated' | 'failed';

export interface TipValidationStatus {
  positions: { position: TipPosition; state: TipValidationState; lastCheckId: string | null; lastPerformedAt: string | null }[];
}
