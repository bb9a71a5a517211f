import { z } from 'zod';

export const PAGE_LIMIT_DEFAULT = 20;
export const PAGE_LIMIT_MAX = 100;

/** Query members every cursor-paginated list accepts. Values above the maximum are lowered to it. */
export const pageQueryShape = {
  limit: z.coerce
    .number()
    .int()
    .min(1)
    .optional()
    .transform((limit) => Math.min(limit ?? PAGE_LIMIT_DEFAULT, PAGE_LIMIT_MAX))
    .meta({
      description: `Items per page, 1 to ${PAGE_LIMIT_MAX} (larger values are lowered to ${PAGE_LIMIT_MAX}); default ${PAGE_LIMIT_DEFAULT}.`,
      example: 20,
    }),
  cursor: z
    .string()
    .min(1)
    .max(1024)
    .optional()
    .meta({
      description:
        'Opaque cursor from the previous page\'s nextCursor. Only valid with the same filters; items may shift ' +
        'between pages while data changes.',
    }),
};

/** `{ data, hasMore, nextCursor? }`; newest first. nextCursor is absent on the last page. */
export function pageSchema<T extends z.ZodType>(item: T, id: string) {
  return z
    .object({
      data: z.array(item),
      hasMore: z.boolean().meta({ description: 'Whether another page follows.' }),
      nextCursor: z.string().optional().meta({ description: 'Pass as `cursor` to get the next page; absent on the last page.' }),
    })
    .meta({ id, description: 'One page of results, newest first.' });
}

export type Page<T> = { data: T[]; hasMore: boolean; nextCursor?: string };
