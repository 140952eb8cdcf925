/**
 * The equipment record (ISO/IEC 17025:2017 §6.4.13) and the audit pack, as the API answers them.
 * Plain types, no zod: the browser imports them as types only.
 */
import type { AssetView, EquipmentRecordItem } from '../assets/views';
import type { AsFound } from '../calibration/interval-review';
import type { ImpactAssessment } from '../calibration/views';
import type { Decision, DecisionRule } from '../checks/decision';
import type { HoldReason } from '../holds/views';

/** A calendar period, both days included; null ends are open. */
export type RecordPeriod = { from: string | null; to: string | null };

/** The stored certificate file as the record saw it: its SHA-256, and whether it opens as a PDF. */
export type RecordCertificateFile = { fileName: string; sizeBytes: number; sha256: string; readable: boolean };

export type RecordCalibration = {
  id: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  certificateUrl: string;
  /** Null when no file is stored for the event. */
  certificate: RecordCertificateFile | null;
  asFound: AsFound;
  asLeft: AsFound;
  /** What the results say about adjustment (the certificate holds the lab's own account). */
  adjustment: string;
  intervalMonths: number;
  dueOn: string;
  note: string | null;
  recordedBy: string | null;
  recordedAt: string;
};

export type RecordCheck = {
  id: string;
  kind: 'tip_validation' | 'two_face' | 'length_check';
  performedAt: string;
  performedBy: string | null;
  position: string | null;
  /** The scale bar of a length check, the probe of a tip validation. */
  relatedAssetTag: string | null;
  inputs: Record<string, unknown>;
  result: Record<string, unknown>;
  /** The inputs and result in words, as printed. */
  inputLines: string[];
  resultLines: string[];
  toleranceUm: number;
  expandedUncertaintyUm: number;
  guardBandUm: number;
  decisionRule: DecisionRule;
  decision: Decision;
  note: string | null;
};

export type RecordHold = {
  id: string;
  reason: HoldReason;
  summary: string;
  startedAt: string;
  startedBy: string | null;
  releasedAt: string | null;
  releasedBy: string | null;
  /** What the release rested on, in words (a check's kind and date, a certificate's number). */
  releaseEvidence: string[];
  releaseNote: string | null;
};

export type RecordIncidentPhoto = { id: string; fileName: string; contentType: string; url: string; thumbnailUrl: string | null };

export type RecordIncident = {
  id: string;
  kind: string;
  description: string;
  occurredAt: string;
  location: string | null;
  state: string;
  resolution: string | null;
  reportedBy: string | null;
  photos: RecordIncidentPhoto[];
};

export type RecordImpactBooking = {
  bookingId: string;
  jobReference: string | null;
  customerName: string | null;
  startsOn: string;
  endsOn: string;
  assessment: ImpactAssessment | null;
  note: string | null;
  assessedBy: string | null;
  assessedAt: string | null;
  /** When the notice to the customer was queued for sending, and to whom. */
  noticeQueuedAt: string | null;
  noticeTo: string | null;
};

export type RecordImpactReview = {
  id: string;
  trigger: 'calibration' | 'check';
  triggerId: string;
  since: string | null;
  foundOn: string;
  state: 'open' | 'closed';
  openedAt: string;
  closedAt: string | null;
  bookings: RecordImpactBooking[];
};

export type RecordCustodyEntry = {
  at: string;
  kind: string;
  by: string | null;
  holder: string | null;
  location: string | null;
  bookingId: string | null;
  note: string | null;
};

export type RecordIntervalChange = { at: string; by: string | null; fromMonths: number | null; toMonths: number | null; reason: string };

/** §6.4.13 f): a reference artefact's certified values and how long they hold. */
export type ReferenceArtefact = {
  values: { label: string; value: string }[];
  certificateNumber: string | null;
  validFrom: string | null;
  validThrough: string | null;
};

/** `GET /api/assets/:id/record`. `contentHash` is the SHA-256 of the canonical content: everything here but
 * `generatedAt`, `contentHash` and today's calibration state, so a reprint of the same content shows the same hash. */
export type EquipmentRecordView = {
  asset: AssetView;
  organization: { name: string };
  period: RecordPeriod;
  items: EquipmentRecordItem[];
  calibrations: RecordCalibration[];
  checks: RecordCheck[];
  holds: RecordHold[];
  incidents: RecordIncident[];
  impactReviews: RecordImpactReview[];
  custody: RecordCustodyEntry[];
  intervalChanges: RecordIntervalChange[];
  reference: ReferenceArtefact | null;
  /** The day the record was put together, in the firm's time zone. */
  recordDate: string;
  contentHash: string;
  generatedAt: string;
};

/** `GET /api/audit-pack/preview`: what a pack for these choices holds, counted before it is built. */
export type AuditPackPreview = { items: number; calibrations: number; certificates: number; estimatedBytes: number };
