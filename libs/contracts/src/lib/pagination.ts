import { z } from 'zod';

/** The largest page any list returns. */
export const MAX_PAGE_SIZE = 100;

/** The `page` and `pageSize` fields of a list's query string, for spreading into its schema. */
export const pageQueryFields = (defaultPageSize = 25) => ({
  page: z.coerce.number().int().min(1, { message: 'page must be 1 or more' }).default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1, { message: 'pageSize must be 1 or more' })
    .max(MAX_PAGE_SIZE, { message: `pageSize must be at most ${MAX_PAGE_SIZE}` })
    .default(defaultPageSize),
});

export const pageQuerySchema = z.object(pageQueryFields());
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

/** A query-string flag written `true` or `false`. */
export const booleanQueryText = (name: string) =>
  z.enum(['true', 'false'], { message: `${name} must be true or false` }).transform((value) => value === 'true');

/** A query-string date or date-time in ISO 8601. */
export const dateQueryText = (name: string) =>
  z.string().refine((value) => !Number.isNaN(Date.parse(value)), { message: `${name} must be a date or date-time (ISO 8601)` });
