import { Router, type RequestHandler } from 'express';
import type { AppDependencies } from '../app.js';
import { ValidationError } from '../shared/errors.js';
import { validate } from '../shared/validate.js';
import { SESSION_COOKIE } from './auth-middleware.js';
import { CSRF_COOKIE, issueCsrfToken, verifyCsrf } from './csrf.js';
import { loginThrottle } from './login-throttle.js';
import { requireRole } from './require-role.js';
import { signInSchema } from './session.schemas.js';
import { sessionOf, signIn, signOut } from './session.service.js';

/** A machine token needs no session: a bearer call to the sign-in route is a mistake of the caller. */
const peopleOnly: RequestHandler = (req, _res, next) => {
  if (req.principal?.kind === 'machine') next(new ValidationError('Machine tokens do not sign in: send the token on every call instead'));
  else next();
};

/** GET /api/session (who am I, refreshes the CSRF cookie), POST (sign in), DELETE (sign out). All public. */
export function sessionRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const secure = settings.server.secureCookies;
  const signInRequest = validate({ body: signInSchema });

  router.get('/session', requireRole(), (req, res) => {
    if (req.session) issueCsrfToken(req, res, secure);
    res.json(sessionOf(req));
  });

  router.post('/session', requireRole(), peopleOnly, verifyCsrf, ...loginThrottle(settings.auth), signInRequest, async (req, res) => {
    await signIn(sequelize, req, res, signInRequest.of(req).body.userName);
    issueCsrfToken(req, res, secure, true);
    res.json(sessionOf(req));
  });

  router.delete('/session', requireRole(), async (req, res) => {
    await signOut(sequelize, req);
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure });
    res.clearCookie(CSRF_COOKIE, { path: '/', sameSite: 'lax', secure });
    res.status(204).end();
  });

  return router;
}
