/**
 * Sign-in and sign-out: local accounts (e-mail + password, rate-limited) and SAML single
 * sign-on. Every sign-in, failed attempt and sign-out is audited.
 */
import express, { Router, type Request, type RequestHandler, type Response } from 'express';
import type { Strategy as SamlStrategy } from '@node-saml/passport-saml';
import type passport from 'passport';
import { loginSchema } from '../../shared/api/schemas';
import type { Config } from '../config';
import { normaliseAttributes } from '../auth/saml';
import { verifyPassword } from '../auth/passwords';
import { currentUser } from '../middleware/auth';
import { issueCsrfToken } from '../middleware/csrf';
import { HttpError } from '../middleware/errors';
import { jsonRateLimit } from '../middleware/rate-limit';
import { User } from '../models/index';
import { audit } from '../services/audit';
import { theOffice } from '../services/office';
import { signInFromSso } from '../services/sso';
import { loadCurrentUser, toMe } from '../services/users';
import { body } from './validate';

/** What the auth router needs. */
export interface AuthDeps { config: Config; saml: { passport: passport.PassportStatic; strategy: SamlStrategy } }

const secureOf = (config: Config) => config.publicUrl.startsWith('https:');

/** Starts a fresh session for the person (prevents session fixation) with a new CSRF token. */
async function startSession(req: Request, res: Response, userId: string, secure: boolean): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  issueCsrfToken(req, res, secure);
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
  await User.update({ lastSignInAt: new Date() }, { where: { id: userId }, silent: true });
}

/** Only app-relative paths are accepted as a place to return to after SSO. */
const safeReturn = (s: unknown): string => (typeof s === 'string' && /^\/(?![/\\])/.test(s) ? s : '/');

/** Creates the /api/auth router. */
export function authRouter(deps: AuthDeps): Router {
  const { config, saml } = deps;
  const secure = secureOf(config);
  const router = Router();

  const loginLimiter = jsonRateLimit({
    windowMs: 15 * 60_000,
    limit: config.loginRateLimit,
    skipSuccessfulRequests: true,
    message: 'Too many sign-in attempts. Wait 15 minutes and try again.',
    keyExtra: (req) => String((req.body as { email?: unknown })?.email ?? '').toLowerCase(),
  });

  const login: RequestHandler = async (req, res) => {
    const { email, password } = body(req, loginSchema);
    const user = await User.findOne({ where: { email: email.toLowerCase() } });
    const ok = await verifyPassword(password, user?.passwordHash ?? null);
    if (!user || !ok || !user.active) {
      await audit({ actorId: user?.id ?? null, action: 'auth.login-failed', entityType: 'user', entityId: user?.id ?? null,
        details: { method: 'local', email, reason: !user ? 'unknown-account' : !ok ? 'wrong-password' : 'inactive' } }, req);
      throw new HttpError(401, 'bad-credentials', 'E-mail or password is not right, or the account is inactive.');
    }
    await startSession(req, res, user.id, secure);
    await audit({ actorId: user.id, action: 'auth.login', entityType: 'user', entityId: user.id, details: { method: 'local' } }, req);
    res.json(toMe((await loadCurrentUser(user.id))!));
  };

  const logout: RequestHandler = async (req, res) => {
    const me = req.me;
    if (me) await audit({ actorId: me.id, action: 'auth.logout', entityType: 'user', entityId: me.id, details: {} }, req);
    // A fresh anonymous session (new id, new CSRF token) rather than none, so the sign-in form works straight away.
    await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
    issueCsrfToken(req, res, secure);
    await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
    res.status(204).end();
  };

  const me: RequestHandler = (req, res) => { res.json(toMe(currentUser(req))); };
  const csrf: RequestHandler = (_req, res) => { res.status(204).end(); };

  const samlLogin: RequestHandler = (req, res, next) => {
    saml.passport.authenticate('saml', { session: false })(req, res, next);
  };

  const samlCallback: RequestHandler = (req, res, next) => {
    const relay = safeReturn((req.body as { RelayState?: unknown })?.RelayState);
    saml.passport.authenticate('saml', { session: false }, async (err: Error | null, profile: Record<string, unknown> | false) => {
      try {
        const fail = async (reason: string, details: Record<string, unknown> = {}) => {
          await audit({ actorId: null, action: 'auth.login-failed', details: { method: 'saml', reason, ...details } }, req);
          res.redirect(303, `/sign-in?sso-error=${encodeURIComponent(reason)}`);
        };
        if (err || !profile) return await fail('invalid-response', { error: err?.message ?? 'no profile' });
        const office = await theOffice();
        const nameId = typeof profile['nameID'] === 'string' ? profile['nameID'] : null;
        const result = await signInFromSso(office.id, nameId, normaliseAttributes(profile));
        if (!result.ok) return await fail(result.reason, { email: result.email });
        await startSession(req, res, result.user.id, secure);
        await audit({ actorId: result.user.id, action: 'auth.login', entityType: 'user', entityId: result.user.id,
          details: { method: 'saml', created: result.created, ssoRoles: result.ssoRoles } }, req);
        if (result.created) await audit({ actorId: result.user.id, action: 'user.created', entityType: 'user', entityId: result.user.id, details: { via: 'saml', roles: result.ssoRoles } }, req);
        res.redirect(303, relay);
      } catch (e) {
        next(e);
      }
    })(req, res, next);
  };

  const metadata: RequestHandler = (_req, res) => {
    res.type('application/samlmetadata+xml').send(saml.strategy.generateServiceProviderMetadata(null, null));
  };

  router.get('/csrf', csrf);
  router.post('/login', loginLimiter, login);
  router.post('/logout', logout);
  router.get('/me', me);
  router.get('/saml/login', samlLogin);
  router.post('/saml/callback', express.urlencoded({ extended: false, limit: '512kb' }), samlCallback);
  router.get('/saml/metadata', metadata);
  return router;
}
