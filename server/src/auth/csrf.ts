import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../shared/errors.js';

/** Angular's HttpClient defaults: it copies this cookie into this header on writes to the same origin. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

/**
 * Makes sure the session holds a CSRF token and (re)sends it in the readable `XSRF-TOKEN` cookie.
 * The token is bound to the session (double submit checked against the session's copy, not only the cookie).
 */
export function issueCsrfToken(req: Request, res: Response, secure: boolean, rotate = false): string {
  if (!req.session) throw new Error('issueCsrfToken needs a session');
  if (rotate || !req.session.csrfToken) req.session.csrfToken = randomBytes(32).toString('base64url');
  res.cookie(CSRF_COOKIE, req.session.csrfToken, { httpOnly: false, sameSite: 'lax', secure, path: '/' });
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/** Refuses a write whose `X-XSRF-TOKEN` header does not match the session's token. */
export const verifyCsrf: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const expected = req.session?.csrfToken;
  const sent = req.get(CSRF_HEADER);
  if (!expected || !sent || !sameToken(sent, expected)) {
    next(new AppError(403, 'CSRF_REJECTED', 'The X-XSRF-TOKEN header is missing or does not match this session: reload and try again'));
    return;
  }
  next();
};

/** Writes authenticated by the session cookie need the CSRF header; bearer-token calls never reach here. */
export const csrfForSignedInWrites: RequestHandler = (req, res, next) => {
  if (req.principal?.kind === 'person') verifyCsrf(req, res, next);
  else next();
};
