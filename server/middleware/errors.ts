/**
 * The one JSON error handler: every failure leaves as an ApiError body, never with a
 * stack trace. Throw {@link HttpError} from handlers; zod errors become 400 with fields.
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiError } from '../../shared/api/types';
import './session-types';

/** An error with an HTTP status and a stable machine code, safe to show to the caller. */
export class HttpError extends Error {
  constructor(public readonly status: number, public readonly code: string, message: string, public readonly fields?: Record<string, string>) {
    super(message);
  }
}

/** 400 validation. */
export const badRequest = (message: string, fields?: Record<string, string>) => new HttpError(400, 'validation', message, fields);
/** 401: not signed in. */
export const unauthorized = (message = 'Sign in first.') => new HttpError(401, 'unauthorized', message);
/** 403: signed in but not allowed. */
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
/** 404: absent, or not visible to the caller (we do not reveal other people's records). */
export const notFound = (what = 'This record') => new HttpError(404, 'not-found', `${what} was not found.`);
/** 409: the record changed since it was read (optimistic locking). */
export const staleVersion = () => new HttpError(409, 'conflict', 'Someone else changed this record since you opened it. Reload and apply your change again.');
/** 409: the action does not fit the record's current state. */
export const wrongState = (message: string) => new HttpError(409, 'invalid-state', message);

/** Turns zod issues into a path → message map. */
export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[k] ??= `${k} is not a field that can be set here`;
    } else fields[key] ??= issue.message;
  }
  return fields;
}

function body(status: number, code: string, message: string, fields?: Record<string, string>): ApiError {
  return { error: { status, code, message, ...(fields ? { fields } : {}) } };
}

/** JSON 404 for /api paths no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(body(404, 'not-found', `No API route ${req.method} ${req.path}.`));
};

/** Final error handler: maps known errors, logs the rest, and never leaks internals. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  let out: ApiError;
  if (err instanceof HttpError) out = body(err.status, err.code, err.message, err.fields);
  else if (err instanceof ZodError) {
    const fields = zodFields(err);
    out = body(400, 'validation', `Please correct: ${Object.entries(fields).map(([k, v]) => (k === '_' ? v : `${k} (${v})`)).join('; ')}`, fields);
  } else {
    const e = err as { type?: string; status?: number; name?: string; message?: string };
    if (e?.type === 'entity.too.large') out = body(413, 'too-large', 'The request body is too large.');
    else if (e?.type === 'entity.parse.failed') out = body(400, 'malformed', 'The request body is not valid JSON.');
    else if (e?.name === 'SequelizeOptimisticLockError') out = body(409, 'conflict', 'Someone else changed this record since you opened it. Reload and apply your change again.');
    else {
      req.log?.error({ err }, 'unhandled error');
      out = body(500, 'internal', 'Something went wrong on the server. The error was logged.');
    }
  }
  if (res.headersSent) return;
  res.status(out.error.status).json(out);
};
