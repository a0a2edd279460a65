import { z } from 'zod';

/** `page` and `pageSize` as they arrive in a query string; pageSize is capped at 200. */
export const pageQuerySchema = z.object({
  page: z.coerce.number().int('Page must be a whole number').min(1, 'Page starts at 1').default(1),
  pageSize: z.coerce
    .number()
    .int('Page size must be a whole number')
    .min(1, 'Page size must be at least 1')
    .max(200, 'Page size can be at most 200')
    .default(25),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

/** A server-side page of items: `{ items, total, page, pageSize }`. */
export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({
    items: z.array(item),
    total: z.number().int().min(0),
    page: z.number().int().min(1),
    pageSize: z.number().int().min(1),
  });
}
export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };
