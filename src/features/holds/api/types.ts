export type HoldReason = 'incident' | 'failed_check' | 'manual';

export interface HoldView {
  id: string;
  assetId: string;
  reason: HoldReason;
  summary: string;
  incidentId: string | null;
  checkId: string | null;
  startedAt: string;
  releasedAt: string | null;
  releaseEvidence: { evidence: { kind: string; id: string; performedAt: string; position?: string | null }[]; note: string | null } | null;
}

export interface HoldList {
  items: HoldView[];
}
