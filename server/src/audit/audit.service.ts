import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import type { Principal } from '../auth/principal.js';
import { AppError } from '../shared/errors.js';
import { AuditEvent, type ActorKind } from './audit-event.model.js';

/** Who did it: the calling principal, or the system itself (the demo seed, a scheduled step). */
export type AuditActor = Principal | { kind: 'system'; name: string } | { kind: 'anonymous'; name: string };

export interface AuditEntry {
  actor: AuditActor;
  /** Dotted verb, entity first: `person.create`, `machine-token.revoke`, `run.release`. */
  action: string;
  /** Kebab-case entity name: `person`, `machine-token`, `run`, `spec-revision`. */
  entityType: string;
  entityId: string | number | null;
  /** Plain JSON of the entity before and after the change (never secrets: no hashes, no token values). */
  before?: unknown;
  after?: unknown;
  requestId?: string | null;
}

function actorColumns(actor: AuditActor): { actorKind: ActorKind; actorId: number | null; actorName: string } {
  switch (actor.kind) {
    case 'person':
      return { actorKind: 'person', actorId: actor.userId, actorName: actor.userName };
    case 'machine':
      return { actorKind: 'machine', actorId: actor.tokenId, actorName: actor.name };
    default:
      return { actorKind: actor.kind, actorId: null, actorName: actor.name.slice(0, 200) };
  }
}

/**
 * Writes one audit event inside the caller's transaction, so the event exists exactly when the change
 * it describes was committed. Every privileged change calls this.
 */
export async function recordAudit(transaction: Transaction, entry: AuditEntry): Promise<void> {
  await AuditEvent.create(
    {
      occurredAt: new Date(),
      ...actorColumns(entry.actor),
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId === null ? null : String(entry.entityId),
      beforeState: entry.before ?? null,
      afterState: entry.after ?? null,
      requestId: entry.requestId ?? null,
    },
    { transaction },
  );
}

/** The request's id (the `x-request-id` answer header set by the app), for audit entries. */
export function requestIdOf(req: Request): string | null {
  const id = req.res?.getHeader('x-request-id');
  return typeof id === 'string' ? id : null;
}

/** Who acts and under which request: what a route hands to a service that audits. */
export interface AuditContext {
  actor: AuditActor;
  requestId: string | null;
}

/** The audit context of a request that passed `requireRole()` (so it has a principal). */
export function auditContextOf(req: Request): AuditContext {
  if (!req.principal) throw new AppError(401, 'UNAUTHENTICATED', 'Sign in first');
  return { actor: req.principal, requestId: requestIdOf(req) };
}
