import { apiUrl } from '../../../lib/api-client';

/** The printable label with its QR code (GET /api/assets/:id/label.pdf), opened in a new tab. */
export const assetLabelUrl = (id: string) => apiUrl(`/assets/${encodeURIComponent(id)}/label.pdf`);
