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

/** One page of a list, with the total number of matching items. */
export const pageSchema = <Item extends z.ZodType>(item: Item) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
export interface Page<Item> {
  items: Item[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * A record id written in a path or query string: decimal digits only, so `0x1`, ` 1` or `1e0`
 * never resolve to record 1 (a plain number coercion would accept all three).
 */
export const idText = (name: string) =>
  z
    .string()
    .regex(/^[1-9][0-9]{0,15}$/, { message: `${name} must be a positive whole number` })
    .transform(Number);

export const idParamsSchema = z.object({ id: idText('id') });

/** A query-string flag written `true` or `false`. */
export const booleanQueryText = (name: string) =>
  z.enum(['true', 'false'], { message: `${name} must be true or false` }).transform((value) => value === 'true');

/** A query-string date or date-time in ISO 8601. */
export const dateQueryText = (name: string) =>
  z.string().refine((value) => !Number.isNaN(Date.parse(value)), { message: `${name} must be a date or date-time (ISO 8601)` });
