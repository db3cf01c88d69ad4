import type { Request, RequestHandler } from 'express';
import { MachineToken } from '../people/machine-token.model.js';
import { AppError } from '../shared/errors.js';
import { bearerTokenOf, machineTokenSha256 } from './machine-tokens.js';
import type { Principal } from './principal.js';

/** last_used_at is written at most this often per token, so a busy watcher does not write on every call. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** The machine behind an `Authorization: Bearer` header: the token must be known and not revoked, else 401. */
export async function machinePrincipal(req: Request): Promise<Principal> {
  const value = bearerTokenOf(req.get('authorization'));
  const token = value ? await MachineToken.findOne({ where: { tokenSha256: machineTokenSha256(value) } }) : null;
  if (!token || token.revokedAt) throw new AppError(401, 'UNAUTHENTICATED', 'The machine token is unknown or revoked');
  const now = new Date();
  if (!token.lastUsedAt || now.getTime() - token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await MachineToken.update({ lastUsedAt: now }, { where: { id: token.id } });
  }
  return { kind: 'machine', tokenId: token.id, name: token.name };
}

/** `req.principal` for a person signed in by session (passport has put the reloaded person on req.user). */
export const personFromSession: RequestHandler = (req, _res, next) => {
  if (req.user) req.principal = { kind: 'person', userId: req.user.userId, userName: req.user.userName, role: req.user.role };
  next();
};
