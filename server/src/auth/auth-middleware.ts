import connectSessionSequelize from 'connect-session-sequelize';
import { Router, type RequestHandler } from 'express';
import session from 'express-session';
import type { AppDependencies } from '../app.js';
import { csrfForSignedInWrites } from './csrf.js';
import { bearerTokenOf } from './machine-tokens.js';
import { passport } from './passport-setup.js';
import { machinePrincipal, personFromSession } from './principal-from-request.js';
import { SESSION_MODEL_NAME } from './session-record.model.js';

export const SESSION_COOKIE = 'clino.sid';

const SequelizeStore = connectSessionSequelize(session.Store);

/**
 * The authentication chain of the API, ahead of every route. A request with `Authorization: Bearer`
 * is a machine (token checked, no session, no CSRF); any other request goes through the session
 * (MariaDB store), passport, and the CSRF check for writes by a signed-in person. Sets `req.principal`;
 * `requireRole()` on each route then decides. Needs initModels to have run on `deps.sequelize`.
 */
export function authMiddleware({ settings, sequelize }: AppDependencies): RequestHandler {
  const maxAge = settings.auth.sessionHours * 3_600_000;
  const store = new SequelizeStore({ db: sequelize, table: SESSION_MODEL_NAME, expiration: maxAge, checkExpirationInterval: 15 * 60_000 });
  const people = Router();
  people.use(
    session({
      name: SESSION_COOKIE,
      secret: settings.server.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: settings.server.secureCookies, maxAge, path: '/' },
    }),
    passport.initialize(),
    passport.session(),
    personFromSession,
    csrfForSignedInWrites,
  );
  return (req, res, next) => {
    if (bearerTokenOf(req.get('authorization')) === undefined) {
      people(req, res, next);
      return;
    }
    machinePrincipal(req).then((principal) => {
      req.principal = principal;
      next();
    }, next);
  };
}
