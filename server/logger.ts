/** Structured logging (pino); the level comes from the configuration. */
import { pino, type Logger } from 'pino';

/** Creates the application logger at the given level. */
export function createLogger(level: string): Logger {
  return pino({ level, base: { app: 'assayer' }, redact: ['req.headers.cookie', 'req.headers["x-xsrf-token"]', 'res.headers["set-cookie"]'] });
}
