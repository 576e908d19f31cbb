/** Rate limiters that answer in the API's JSON error shape (login now; letter verification later). */
import { ipKeyGenerator, rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { Request } from 'express';

/** Options: window, allowed hits, message, and an optional extra key part (e.g. the e-mail tried). */
export interface JsonRateLimitOptions {
  windowMs: number;
  limit: number;
  message: string;
  /** Count only failed requests (status >= 400). */
  skipSuccessfulRequests?: boolean;
  keyExtra?: (req: Request) => string;
}

/** A limiter keyed by client address (IPv6 grouped by /56) plus `keyExtra`, answering 429 with code "rate-limited". */
export function jsonRateLimit(o: JsonRateLimitOptions): RateLimitRequestHandler {
  return rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    skipSuccessfulRequests: o.skipSuccessfulRequests ?? false,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${o.keyExtra?.(req) ?? ''}`,
    handler: (_req, res) => { res.status(429).json({ error: { status: 429, code: 'rate-limited', message: o.message } }); },
  });
}
