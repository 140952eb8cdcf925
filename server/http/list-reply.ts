/** API.md "Lists": `{items, total}`, here for short lists that come back whole. */
export const listReply = <T>(items: T[]) => ({ items, total: items.length });
