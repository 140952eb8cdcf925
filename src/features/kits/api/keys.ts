import { kitsQueryRoot } from '../../../lib/asset-status';

export const kitsKeys = {
  all: kitsQueryRoot,
  list: (page: { limit: number; offset: number }) => [...kitsKeys.all, 'list', page] as const,
  one: (id: string) => [...kitsKeys.all, 'one', id] as const,
  shippingSheet: (id: string) => [...kitsKeys.one(id), 'shipping-sheet'] as const,
  candidates: (q: string) => [...kitsKeys.all, 'candidates', q] as const,
};
