/** Incident words and photo limits without zod, for the browser too. */
export const incidentKinds = ['dropped', 'impact', 'missing', 'malfunction', 'other'] as const;
export type IncidentKind = (typeof incidentKinds)[number];
export const incidentKindTitles: Record<IncidentKind, string> = {
  dropped: 'Dropped',
  impact: 'Knocked or hit',
  missing: 'Missing',
  malfunction: 'Not working right',
  other: 'Something else',
};

export const incidentStates = ['reported', 'reviewing', 'resolved'] as const;
export type IncidentState = (typeof incidentStates)[number];
export const incidentStateTitles: Record<IncidentState, string> = { reported: 'Reported', reviewing: 'Under review', resolved: 'Resolved' };

export const MAX_INCIDENT_PHOTOS = 6;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const photoTypes = ['image/jpeg', 'image/png', 'image/heic', 'image/heif'] as const;
