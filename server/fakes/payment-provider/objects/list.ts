/** The provider's list envelope. */
export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

const DEFAULT_PAGE_SIZE = 10;
const MAX_PAGE_SIZE = 100;

/** Newest first, cursor by `starting_after` (an id in the previous page), as the provider pages lists. */
export function pageOf<T extends { id: string; created: number }>(
  items: readonly T[],
  url: string,
  options: { limit?: number; startingAfter?: string },
): ListObject<T> {
  const ordered = items
    .map((item, index) => ({ item, index }))
    .sort((a, b) => b.item.created - a.item.created || b.index - a.index)
    .map(({ item }) => item);
  const limit = Math.min(Math.max(1, options.limit ?? DEFAULT_PAGE_SIZE), MAX_PAGE_SIZE);
  const start = options.startingAfter ? ordered.findIndex((item) => item.id === options.startingAfter) + 1 : 0;
  const data = ordered.slice(start, start + limit);
  return { object: 'list', data, has_more: start + limit < ordered.length, url };
}
