import type { Request, RequestHandler } from 'express';
import { MachineToken } from '../people/machine-token.model.js';
import { User } from '../people/user.model.js';
import { AppError } from '../shared/errors.js';
import { bearerTokenOf, machineTokenSha256 } from './machine-tokens.js';
import type { Principal } from './principal.js';

/** last_used_at is written at most this often per token, so a busy watcher does not write on every call. */
const LAST_USED_RESOLUTION_MS = 60_000;

/**
 * The machine behind an `Authorization: Bearer` header: the token must be known and not revoked, else
 * 401. A token with an owner carries the owner; an owner who has been deactivated makes the token
 * refused too (401), as the person's own sessions end.
 */
export async function machinePrincipal(req: Request): Promise<Principal> {
  const value = bearerTokenOf(req.get('authorization'));
  const token = value ? await MachineToken.findOne({ where: { tokenSha256: machineTokenSha256(value) }, include: [{ model: User, as: 'owner' }] }) : null;
  if (!token || token.revokedAt) throw new AppError(401, 'UNAUTHENTICATED', 'The machine token is unknown or revoked');
  const owner = token.owner;
  if (owner && !owner.active) throw new AppError(401, 'UNAUTHENTICATED', `The machine token belongs to ${owner.userName}, who is inactive: an admin must give the work a new token`);
  const now = new Date();
  if (!token.lastUsedAt || now.getTime() - token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await MachineToken.update({ lastUsedAt: now }, { where: { id: token.id } });
  }
  const principal: Principal = { kind: 'machine', tokenId: token.id, name: token.name };
  return owner ? { ...principal, owner: { userId: owner.id, userName: owner.userName, role: owner.role } } : principal;
}

/** `req.principal` for a person signed in by session (passport has put the reloaded person on req.user). */
export const personFromSession: RequestHandler = (req, _res, next) => {
  if (req.user) req.principal = { kind: 'person', userId: req.user.userId, userName: req.user.userName, role: req.user.role };
  next();
};
