import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError, fieldsFromZod } from './errors';

type Part = 'body' | 'query' | 'params';

/** Parses one part of the request with a shared schema; the parsed value is in `res.locals[part]`. */
export function validate<T extends z.ZodType>(part: Part, schema: T): RequestHandler {
  return (req, res, next) => {
    const result = schema.safeParse(req[part] ?? {});
    if (!result.success) {
      next(AppError.validation(fieldsFromZod(result.error)));
      return;
    }
    res.locals[part] = result.data;
    next();
  };
}

export function parsed<T extends z.ZodType>(
  res: { locals: Record<string, unknown> },
  part: Part,
  _schema: T,
): z.infer<T> {
  return res.locals[part] as z.infer<T>;
}
