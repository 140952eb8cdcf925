/** What the holds API answers. Plain types, no zod: the browser imports them as types only. */

export type HoldReason = 'incident' | 'failed_check' | 'manual';

/** What a release rested on: the calibration or passing checks recorded after the hold began. */
export type HoldReleaseEvidence = {
  evidence: { kind: string; id: string; performedAt: string; position?: string | null }[];
  note: string | null;
};

export type HoldView = {
  id: string;
  assetId: string;
  reason: HoldReason;
  summary: string;
  incidentId: string | null;
  checkId: string | null;
  startedAt: string;
  releasedAt: string | null;
  releaseEvidence: HoldReleaseEvidence | null;
};
