import type { ErrorRequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';

export type ErrorCode =
  | 'validation_failed'
  | 'invalid_json'
  | 'unauthenticated'
  | 'invalid_credentials'
  | 'forbidden'
  | 'csrf_invalid'
  | 'not_found'
  | 'conflict'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'rate_limited'
  | 'link_unknown'
  | 'link_used'
  | 'link_expired'
  | 'link_revoked'
  | 'not_ready'
  | 'internal';

/** The one error type: what went wrong, for whom it is meant, and the HTTP status it maps to. */
export class AppError extends Error {
  override name = 'AppError';
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string>,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }

  static validation(fields: Record<string, string>, message = 'Some fields need attention') {
    return new AppError('validation_failed', message, 400, fields);
  }
  static notFound(what = 'That') {
    return new AppError('not_found', `${what} was not found`, 404);
  }
  static forbidden(message = 'You do not have access to this') {
    return new AppError('forbidden', message, 403);
  }
  static unauthenticated(message = 'Please sign in') {
    return new AppError('unauthenticated', message, 401);
  }
  static conflict(message: string, fields?: Record<string, string>) {
    return new AppError('conflict', message, 409, fields);
  }
}

export function fieldsFromZod(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/** Turns anything thrown into the public error shape; unexpected errors are logged, never shown. */
export function handleError(err: unknown, logger?: Logger): { status: number; body: ErrorBody } {
  const appError = toAppError(err);
  if (appError.status >= 500) logger?.error({ err }, 'unhandled error');
  const { code, message, fields } = appError;
  return { status: appError.status, body: { error: fields ? { code, message, fields } : { code, message } } };
}

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return AppError.validation(fieldsFromZod(err));
  const e = err as { type?: string; status?: number; code?: string; name?: string };
  if (e?.name === 'MulterError') {
    if (e.code === 'LIMIT_FILE_SIZE')
      return new AppError('payload_too_large', 'Each file can be at most 15 MB', 413);
    if (e.code === 'LIMIT_FILE_COUNT' || e.code === 'LIMIT_UNEXPECTED_FILE') {
      return AppError.validation(
        { files: 'Send at most 10 files at a time, in the `files` field' },
        'Too many files',
      );
    }
    return AppError.validation({ files: 'The upload could not be read' });
  }
  if (e?.type === 'entity.too.large') {
    return new AppError('payload_too_large', 'The request body is too large (1 MB at most)', 413);
  }
  if (e?.type === 'entity.parse.failed') {
    return new AppError('invalid_json', 'The request body is not valid JSON', 400);
  }
  if (e?.code === 'EBADCSRFTOKEN' || (e?.status === 403 && /csrf/i.test(String((err as Error).message)))) {
    return new AppError(
      'csrf_invalid',
      'Your session token is missing or expired: reload and try again',
      403,
    );
  }
  return new AppError('internal', 'Something went wrong on our side. Please try again.', 500, undefined, {
    cause: err,
  });
}

export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    const { status, body } = handleError(err, (req as { log?: Logger }).log ?? logger);
    if (res.headersSent) return;
    res.status(status).json(body);
  };
}
