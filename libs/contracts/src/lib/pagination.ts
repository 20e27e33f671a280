import { z } from 'zod';

/** The largest page any list returns. */
export const MAX_PAGE_SIZE = 100;

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1, { message: 'page must be 1 or more' }).default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1, { message: 'pageSize must be 1 or more' })
    .max(MAX_PAGE_SIZE, { message: `pageSize must be at most ${MAX_PAGE_SIZE}` })
    .default(25),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

/** One page of a list, with the total number of matching items. */
export const pageSchema = <Item extends z.ZodType>(item: Item) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
export interface Page<Item> {
  items: Item[];
  total: number;
  page: number;
  pageSize: number;
}

export const idParamsSchema = z.object({
  id: z.coerce.number().int().positive({ message: 'id must be a positive whole number' }),
});
