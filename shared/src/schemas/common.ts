import { z } from 'zod';

// A missing field reads "Required" rather than a type error, in the API and the forms alike.
z.config({
  customError: (issue) =>
    issue.code === 'invalid_type' && issue.input === undefined ? 'Required' : undefined,
});

/** Every error the API sends: `{ error: { code, message, fields? } }`. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const idSchema = z.coerce.number().int().positive();

export const idParamsSchema = z.object({ id: idSchema });

export const listQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  q: z.string().trim().max(200).optional(),
});
export type ListQuery = z.infer<typeof listQuerySchema>;

export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), total: z.number().int().min(0) });
}
export interface Page<T> {
  items: T[];
  total: number;
}

export const emailSchema = z
  .string()
  .trim()
  .max(254)
  .pipe(z.email({ message: 'Enter a valid e-mail address' }))
  .transform((v) => v.toLowerCase());

export const nameSchema = z.string().trim().min(1, 'Required').max(120);
