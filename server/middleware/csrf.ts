/**
 * CSRF protection following Angular's HttpClient convention: a readable cookie
 * XSRF-TOKEN carries a token bound to the session, and every state-changing request
 * must echo it in the X-XSRF-TOKEN header. Login is covered too, since any GET
 * (or GET /api/auth/csrf) issues the token before the form is sent.
 */
import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { HttpError } from './errors';
import './session-types';

/** Name of the readable cookie. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
/** Name of the header the client echoes the token in. */
export const CSRF_HEADER = 'x-xsrf-token';
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Creates a fresh token in the session and sends it as the cookie (call after sign-in and sign-out). */
export function issueCsrfToken(req: Request, res: Response, secure: boolean): string {
  const token = randomBytes(32).toString('base64url');
  req.session.csrfToken = token;
  res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'strict', secure, path: '/' });
  return token;
}

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * Middleware for /api. `exempt` lists paths that receive cross-site POSTs protected
 * by other means (the SAML callback is signed and bound to our AuthnRequest id).
 * `quiet` lists GET paths that should not create sessions (health checks).
 */
export function csrfProtection(opts: { secure: boolean; exempt: string[]; quiet: string[] }): RequestHandler {
  return (req, res, next) => {
    if (SAFE.has(req.method)) {
      if (!opts.quiet.includes(req.path)) {
        const token = req.session.csrfToken ?? issueCsrfToken(req, res, opts.secure);
        if (req.cookies?.[CSRF_COOKIE] !== token) res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'strict', secure: opts.secure, path: '/' });
      }
      return next();
    }
    if (opts.exempt.includes(req.path)) return next();
    const sent = req.get(CSRF_HEADER);
    const expected = req.session.csrfToken;
    if (!sent || !expected || !same(sent, expected)) {
      throw new HttpError(403, 'csrf', 'The form was out of date or sent from elsewhere (missing or wrong X-XSRF-TOKEN). Reload the page and try again.');
    }
    next();
  };
}
