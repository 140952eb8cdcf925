import type { Page } from '../../shared/lists/page';

/** API.md "Lists": `{items, total}`, here for short lists that come back whole. */
export const listReply = <T>(items: T[]): Page<T> => ({ items, total: items.length });
