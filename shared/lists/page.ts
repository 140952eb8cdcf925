/** API.md "Lists": one page of `items` and how many there are in all. */
export type Page<T> = { items: T[]; total: number };
