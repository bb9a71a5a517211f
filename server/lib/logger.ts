import pino, { type Logger } from 'pino';

export type { Logger };

/** Credentials never reach the log: request cookies and Authorization headers, response Set-Cookie. */
const REDACTED_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  'res.headers["set-cookie"]',
  '*.password',
  '*.secret',
];

export function createLogger(level: string): Logger {
  return pino({ level, redact: { paths: REDACTED_PATHS, censor: '[redacted]' } });
}
