import type { NextFunction, Request, Response } from 'express';
import type { Sequelize } from 'sequelize';
import { recordAudit, requestIdOf } from '../audit/audit.service.js';
import { AppError } from '../shared/errors.js';
import { passport } from './passport-setup.js';
import type { SessionDto } from './session.schemas.js';

/** The caller as the session routes show it. */
export function sessionOf(req: Request): SessionDto {
  const principal = req.principal;
  if (!principal) return { principal: null };
  if (principal.kind === 'machine') {
    const owner = principal.owner ? { id: principal.owner.userId, userName: principal.owner.userName, role: principal.owner.role } : null;
    return { principal: { kind: 'machine', id: principal.tokenId, name: principal.name, owner } };
  }
  const displayName = req.user?.displayName ?? principal.userName;
  return { principal: { kind: 'person', id: principal.userId, userName: principal.userName, displayName, role: principal.role } };
}

function checkPassword(req: Request, res: Response): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    const next: NextFunction = (err?: unknown) => reject(err instanceof Error ? err : new Error(String(err)));
    passport.authenticate('local', { session: false }, (err: unknown, user: Express.User | false) => {
      if (err) reject(err instanceof Error ? err : new Error(String(err)));
      else resolve(user);
    })(req, res, next);
  });
}

function logIn(req: Request, user: Express.User): Promise<void> {
  return new Promise((resolve, reject) => req.logIn(user, (err: unknown) => (err ? reject(err instanceof Error ? err : new Error(String(err))) : resolve())));
}

/**
 * Signs a person in (local strategy: user name and password, active people only), regenerating the
 * session so no earlier session id survives. Success and failure are both audited.
 */
export async function signIn(sequelize: Sequelize, req: Request, res: Response, userName: string): Promise<Express.User> {
  const user = await checkPassword(req, res);
  const requestId = requestIdOf(req);
  if (!user) {
    await sequelize.transaction((t) =>
      recordAudit(t, { actor: { kind: 'anonymous', name: userName }, action: 'session.sign-in-failed', entityType: 'session', entityId: null, requestId }),
    );
    throw new AppError(401, 'UNAUTHENTICATED', 'The user name or the password is wrong, or the account is inactive');
  }
  await logIn(req, user);
  req.principal = { kind: 'person', userId: user.userId, userName: user.userName, role: user.role };
  const actor = req.principal;
  await sequelize.transaction((t) => recordAudit(t, { actor, action: 'session.sign-in', entityType: 'person', entityId: user.userId, requestId }));
  return user;
}

/** Ends the caller's session (a no-op without one); a person's sign-out is audited. */
export async function signOut(sequelize: Sequelize, req: Request): Promise<void> {
  const principal = req.principal;
  if (principal?.kind === 'person') {
    await sequelize.transaction((t) =>
      recordAudit(t, { actor: principal, action: 'session.sign-out', entityType: 'person', entityId: principal.userId, requestId: requestIdOf(req) }),
    );
  }
  if (!req.session) return;
  await new Promise<void>((resolve, reject) => req.logout((err: unknown) => (err ? reject(err instanceof Error ? err : new Error(String(err))) : resolve())));
  await new Promise<void>((resolve, reject) => req.session.destroy((err: unknown) => (err ? reject(err instanceof Error ? err : new Error(String(err))) : resolve())));
}
