/** Parsing request bodies and queries with the shared zod schemas. */
import type { Request } from 'express';
import type { z } from 'zod';

/** Parses the JSON body; a ZodError reaches the error handler as a 400 with fields. */
export function body<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  return schema.parse(req.body ?? {});
}

/** Parses the query string. */
export function query<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  return schema.parse(req.query ?? {});
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** True when the text is a UUID (ids that are not cannot exist, so they are answered with 404). */
export const isUuid = (s: unknown): s is string => typeof s === 'string' && UUID.test(s);
