/** What the incidents API answers. Plain types, no zod: the browser imports them as types only. */
import type { AssetStatus, AssetType } from '../assets/vocabulary';
import type { IncidentKind, IncidentState } from './vocabulary';

export type IncidentPhotoView = {
  id: string;
  contentType: string;
  fileName: string;
  sizeBytes: number;
  url: string;
  /** Null for HEIC (no thumbnail is made). */
  thumbnailUrl: string | null;
};

export type IncidentView = {
  id: string;
  assetId: string;
  /** Present when the server loaded the item with the incident (lists and single incidents do). */
  asset?: { id: string; assetTag: string; type: AssetType; status: AssetStatus };
  kind: IncidentKind;
  description: string;
  occurredAt: string;
  location: string | null;
  bookingId: string | null;
  /** The customer of the job or rental the item came back from, for incidents opened at return. */
  customerName: string | null;
  state: IncidentState;
  resolution: string | null;
  chargeAmountMinor: number | null;
  reportedBy: string;
  createdAt: string;
  updatedAt: string;
  photos: IncidentPhotoView[];
};
