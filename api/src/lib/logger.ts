import { pino, type Logger } from 'pino';
import type { Config } from '../config';

/** Secrets never reach the log: cookies, tokens and passwords are redacted wherever they appear. */
export const REDACT_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-csrf-token"]',
  'res.headers["set-cookie"]',
  '*.password',
  '*.passwordHash',
  '*.token',
  '*.current',
  '*.next',
];

export function createLogger(config: Pick<Config, 'LOG_LEVEL' | 'NODE_ENV'>): Logger {
  return pino({
    level: config.LOG_LEVEL ?? (config.NODE_ENV === 'test' ? 'silent' : 'info'),
    redact: { paths: REDACT_PATHS, censor: '[redacted]' },
  });
}
