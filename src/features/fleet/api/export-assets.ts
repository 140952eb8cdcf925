import { apiUrl } from '../../../lib/api-client';
import { assetFilterQuery } from './get-assets';
import type { AssetFilter } from './keys';

/** GET /api/assets/export.csv with the list's current filters: a plain download link. */
export const exportAssetsUrl = (filter: AssetFilter, sort?: string) => apiUrl('/assets/export.csv', { ...assetFilterQuery(filter), sort });
