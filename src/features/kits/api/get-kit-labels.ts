import { apiUrl } from '../../../lib/api-client';

/** Every member's label on one printable sheet (GET /api/kits/:id/labels.pdf). */
export const kitLabelsUrl = (id: string) => apiUrl(`/kits/${encodeURIComponent(id)}/labels.pdf`);
