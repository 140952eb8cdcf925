import type { AssetStatus, AssetType } from '../../../lib/assets';
import type { IncidentKind, IncidentState } from '../../../../shared/schemas/incidents';

export type { IncidentKind, IncidentState } from '../../../../shared/schemas/incidents';

export interface IncidentPhoto {
  id: string;
  contentType: string;
  fileName: string;
  sizeBytes: number;
  url: string;
  /** Null for HEIC (no thumbnail is made). */
  thumbnailUrl: string | null;
}

export interface IncidentView {
  id: string;
  assetId: string;
  asset?: { id: string; assetTag: string; type: AssetType; status: AssetStatus };
  kind: IncidentKind;
  description: string;
  occurredAt: string;
  location: string | null;
  bookingId: string | null;
  state: IncidentState;
  resolution: string | null;
  chargeAmountMinor: number | null;
  reportedBy: string;
  createdAt: string;
  updatedAt: string;
  photos: IncidentPhoto[];
}

export interface IncidentPage {
  items: IncidentView[];
  total: number;
}

export interface IncidentListParams {
  assetId?: string;
  state?: IncidentState[];
  limit: number;
  offset: number;
}

export interface ReportIncidentInput {
  assetId: string;
  kind: IncidentKind;
  description: string;
  /** ISO date-time with offset. */
  occurredAt: string;
  location?: string;
  bookingId?: string;
  photos: File[];
}

export interface UpdateIncidentInput {
  id: string;
  state?: 'reviewing' | 'resolved';
  resolution?: string | null;
  chargeAmountMinor?: number | null;
}
