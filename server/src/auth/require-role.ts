import type { RequestHandler } from 'express';
import { AppError } from '../shared/errors.js';
import { roleMatrix } from './role-matrix.js';

/**
 * Enforces the committed role matrix for the route it guards: the key is the request method and the
 * route's full pattern (`GET /api/runs/:id`). A route missing from the matrix is closed to everyone.
 */
export function requireRole(): RequestHandler {
  return (req, _res, next) => {
    const key = `${req.method} ${req.baseUrl}${String(req.route?.path ?? '')}`;
    const allowed = roleMatrix[key];
    if (!allowed) {
      req.log.error({ key }, 'route missing from the role matrix');
      next(new AppError(403, 'FORBIDDEN', 'This route is not open to anyone'));
      return;
    }
    if (allowed.includes('public')) return next();
    const principal = req.principal;
    if (!principal) return next(new AppError(401, 'UNAUTHENTICATED', 'Sign in first'));
    const grantee = principal.kind === 'machine' ? 'machine' : principal.role;
    if (!allowed.includes(grantee)) return next(new AppError(403, 'FORBIDDEN', 'Your role may not do this'));
    next();
  };
}
