import type { Sequelize, Transaction } from 'sequelize';
import { recordAudit, type AuditContext } from '../audit/audit.service.js';
import { machineTokenSha256, newMachineTokenValue } from '../auth/machine-tokens.js';
import { NotFoundError, ValidationError } from '../shared/errors.js';
import { mayAuthorSpecs } from '../specs/spec-authorship.js';
import { MachineToken } from './machine-token.model.js';
import type { CreateMachineTokenInput, CreatedMachineTokenDto, MachineTokenDto } from './machine-tokens.schemas.js';
import { User } from './user.model.js';

/** The token as the API shows it; `owner` defaults to the loaded association. */
export function machineTokenDto(token: MachineToken, createdBy: User | null | undefined, owner: User | null | undefined = token.owner): MachineTokenDto {
  return {
    id: token.id,
    name: token.name,
    createdBy: createdBy ? { id: createdBy.id, userName: createdBy.userName } : null,
    owner: owner ? { id: owner.id, userName: owner.userName, role: owner.role } : null,
    createdAt: token.createdAt.toISOString(),
    lastUsedAt: token.lastUsedAt?.toISOString() ?? null,
    revokedAt: token.revokedAt?.toISOString() ?? null,
  };
}

const PEOPLE = [
  { model: User, as: 'createdBy' },
  { model: User, as: 'owner' },
];

/** Every token, newest first, revoked ones included (the audit trail names them). */
export async function listMachineTokens(): Promise<MachineTokenDto[]> {
  const tokens = await MachineToken.findAll({ include: PEOPLE, order: [['createdAt', 'DESC'], ['id', 'DESC']] });
  return tokens.map((t) => machineTokenDto(t, t.createdBy));
}

/** The owner named at creation: an active person whose role may push specs (else VALIDATION_FAILED on ownerUserId). */
async function ownerFor(ownerUserId: number | undefined, transaction: Transaction): Promise<User | null> {
  if (ownerUserId === undefined) return null;
  const owner = await User.findByPk(ownerUserId, { transaction });
  const problem = !owner ? `no person has id ${ownerUserId}` : !owner.active ? `${owner.userName} is inactive` : !mayAuthorSpecs(owner.role) ? `${owner.userName} is ${owner.role}, a role that may not push specs` : null;
  if (problem !== null) throw new ValidationError(`The token's owner must be an active person who may push specs: ${problem}`, { issues: [{ in: 'body', path: 'ownerUserId', message: problem }] });
  return owner;
}

/** A new token: its value is returned here once and stored only as its sha256. */
export async function createMachineToken(sequelize: Sequelize, ctx: AuditContext, input: CreateMachineTokenInput): Promise<CreatedMachineTokenDto> {
  const value = newMachineTokenValue();
  const creator = ctx.actor.kind === 'person' ? await User.findByPk(ctx.actor.userId) : null;
  return sequelize.transaction(async (transaction) => {
    const owner = await ownerFor(input.ownerUserId, transaction);
    const token = await MachineToken.create(
      { name: input.name, tokenSha256: machineTokenSha256(value), createdByUserId: creator?.id ?? null, ownerUserId: owner?.id ?? null, lastUsedAt: null, revokedAt: null },
      { transaction },
    );
    const dto = machineTokenDto(token, creator, owner);
    await recordAudit(transaction, { ...ctx, action: 'machine-token.create', entityType: 'machine-token', entityId: token.id, after: dto });
    return { token: dto, value };
  });
}

/** Revokes a token at once (its next call gets 401); revoking a revoked token changes nothing. */
export async function revokeMachineToken(sequelize: Sequelize, ctx: AuditContext, id: number): Promise<MachineTokenDto> {
  return sequelize.transaction(async (transaction) => {
    const token = await MachineToken.findByPk(id, { include: PEOPLE, transaction, lock: transaction.LOCK.UPDATE });
    if (!token) throw new NotFoundError(`No machine token with id ${id}`);
    if (token.revokedAt) return machineTokenDto(token, token.createdBy);
    const before = machineTokenDto(token, token.createdBy);
    token.revokedAt = new Date();
    await token.save({ transaction });
    const after = machineTokenDto(token, token.createdBy);
    await recordAudit(transaction, { ...ctx, action: 'machine-token.revoke', entityType: 'machine-token', entityId: id, before, after });
    return after;
  });
}
