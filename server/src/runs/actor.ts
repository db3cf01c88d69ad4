import type { Request } from 'express';
import type { Principal } from '../auth/principal.js';
import { AppError } from '../shared/errors.js';
import type { PrincipalKind } from '../specs/spec-revision.model.js';

/** Who acts, as stored beside what they did: a person (user id) or a machine token (token id). */
export interface Actor {
  kind: PrincipalKind;
  id: number;
  name: string;
  principal: Principal;
}

export function actorOf(principal: Principal | undefined): Actor {
  if (!principal) throw new AppError(401, 'UNAUTHENTICATED', 'Sign in first');
  return principal.kind === 'person'
    ? { kind: 'person', id: principal.userId, name: principal.userName, principal }
    : { kind: 'machine', id: principal.tokenId, name: principal.name, principal };
}

/** The calling actor; requireRole() has already refused a request without one. */
export function actorOfRequest(req: Request): Actor {
  return actorOf(req.principal);
}

/** An actor's name as stored: people by name, machines marked so they are never mistaken for people. */
export function actorLabel(actor: Actor): string {
  return actor.kind === 'person' ? actor.name : `machine:${actor.name}`;
}
