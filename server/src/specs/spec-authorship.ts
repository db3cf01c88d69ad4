import type { Transaction } from 'sequelize';
import type { Role } from '../auth/principal.js';
import { roleMatrix } from '../auth/role-matrix.js';
import type { Actor } from '../runs/actor.js';
import { AppError } from '../shared/errors.js';
import { SpecRevision, type PrincipalKind } from './spec-revision.model.js';

/** Who a spec revision is stored as written by: a person, or a machine token that belongs to nobody. */
export interface SpecAuthor {
  kind: PrincipalKind;
  id: number;
  name: string;
}

/** Whether people of this role may write specs: the roles the role matrix grants `POST /api/specs`. */
export function mayAuthorSpecs(role: Role): boolean {
  return (roleMatrix['POST /api/specs'] ?? []).includes(role);
}

/**
 * The author of a push: the signed-in person; for a machine token with an owner, that owner (a token
 * acting for a person writes no more than that person may: FORBIDDEN when the owner's role may not
 * push specs); for a token without an owner, the token itself.
 */
export function specAuthorOf(actor: Actor): SpecAuthor {
  const principal = actor.principal;
  if (principal.kind === 'person') return { kind: 'person', id: principal.userId, name: principal.userName };
  const owner = principal.owner;
  if (owner === undefined) return { kind: 'machine', id: principal.tokenId, name: principal.name };
  if (!mayAuthorSpecs(owner.role)) {
    throw new AppError(403, 'FORBIDDEN', `The machine token ${principal.name} acts for ${owner.userName}, whose role (${owner.role}) may not push specs`);
  }
  return { kind: 'person', id: owner.userId, name: owner.userName };
}

/**
 * The people who wrote a revision's text: the person authors of every revision of the same spec with
 * the same sha256 (the revision itself, and any person who pushed that exact text before or after an
 * ownerless machine did). Empty when only ownerless machines pushed it.
 */
export async function personAuthorsOfText(revision: SpecRevision, transaction?: Transaction): Promise<SpecRevision[]> {
  return SpecRevision.findAll({
    where: { specId: revision.specId, sha256: revision.sha256, authorKind: 'person' },
    attributes: ['id', 'number', 'authorId', 'authorName'],
    order: [['number', 'ASC']],
    transaction,
  });
}
