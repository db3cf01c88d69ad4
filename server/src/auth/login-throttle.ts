import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Settings } from '../config.js';
import { AppError } from '../shared/errors.js';

/** Spraying many user names from one address is throttled too, at this multiple of the per-name limit. */
const PER_ADDRESS_FACTOR = 10;

function userNameOf(body: unknown): string {
  const name = typeof body === 'object' && body !== null ? (body as Record<string, unknown>).userName : undefined;
  return typeof name === 'string' ? name.trim().toLowerCase().slice(0, 64) : '';
}

/**
 * Sign-in throttling: failed attempts (any answer of 400 or more) are counted per address and user
 * name over the configured window; once the limit is reached every attempt, right or wrong, gets
 * TOO_MANY_REQUESTS until the window passes. Counts live in this process's memory (one server process).
 */
export function loginThrottle(auth: Settings['auth']): RequestHandler[] {
  const windowMs = auth.loginWindowMinutes * 60_000;
  const lockedOut: RequestHandler = (_req, _res, next) =>
    next(new AppError(429, 'TOO_MANY_REQUESTS', `Too many failed sign-ins: try again in ${auth.loginWindowMinutes} minutes`));
  const common = { windowMs, skipSuccessfulRequests: true, standardHeaders: 'draft-8', legacyHeaders: false, handler: lockedOut } as const;
  return [
    rateLimit({ ...common, limit: auth.loginMaxFailures * PER_ADDRESS_FACTOR, keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown') }),
    rateLimit({ ...common, limit: auth.loginMaxFailures, keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? 'unknown')}|${userNameOf(req.body)}` }),
  ];
}
