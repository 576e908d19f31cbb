/** Resolves the signed-in person from the session and guards routes by role. */
import type { Request, RequestHandler } from 'express';
import type { Role } from '../../shared/api/types';
import { loadCurrentUser } from '../services/users';
import { forbidden, unauthorized } from './errors';
import type { CurrentUser } from './session-types';
import './session-types';

/** Loads req.me from the session; a deactivated or deleted person is signed out. */
export const loadUser: RequestHandler = async (req, _res, next) => {
  const userId = req.session?.userId;
  if (userId) {
    const me = await loadCurrentUser(userId);
    if (me) req.me = me;
    else delete req.session.userId;
  }
  next();
};

/** The signed-in person, or a 401. */
export function currentUser(req: Request): CurrentUser {
  if (!req.me) throw unauthorized();
  return req.me;
}

/** Requires a signed-in person. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  currentUser(req);
  next();
};

/** Requires a signed-in person holding at least one of the roles. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    const me = currentUser(req);
    if (!roles.some((r) => me.roles.includes(r))) throw forbidden(`This needs the ${roles.join(' or ')} role.`);
    next();
  };
}

/** True when the person holds the role. */
export const hasRole = (me: CurrentUser, role: Role): boolean => me.roles.includes(role);
