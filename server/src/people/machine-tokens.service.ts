import type { Sequelize } from 'sequelize';
import { recordAudit, type AuditContext } from '../audit/audit.service.js';
import { machineTokenSha256, newMachineTokenValue } from '../auth/machine-tokens.js';
import { NotFoundError } from '../shared/errors.js';
import { MachineToken } from './machine-token.model.js';
import type { CreateMachineTokenInput, CreatedMachineTokenDto, MachineTokenDto } from './machine-tokens.schemas.js';
import { User } from './user.model.js';

export function machineTokenDto(token: MachineToken, createdBy: User | null | undefined): MachineTokenDto {
  return {
    id: token.id,
    name: token.name,
    createdBy: createdBy ? { id: createdBy.id, userName: createdBy.userName } : null,
    createdAt: token.createdAt.toISOString(),
    lastUsedAt: token.lastUsedAt?.toISOString() ?? null,
    revokedAt: token.revokedAt?.toISOString() ?? null,
  };
}

/** Every token, newest first, revoked ones included (the audit trail names them). */
export async function listMachineTokens(): Promise<MachineTokenDto[]> {
  const tokens = await MachineToken.findAll({ include: [{ model: User, as: 'createdBy' }], order: [['createdAt', 'DESC'], ['id', 'DESC']] });
  return tokens.map((t) => machineTokenDto(t, t.createdBy));
}

/** A new token: its value is returned here once and stored only as its sha256. */
export async function createMachineToken(sequelize: Sequelize, ctx: AuditContext, input: CreateMachineTokenInput): Promise<CreatedMachineTokenDto> {
  const value = newMachineTokenValue();
  const creator = ctx.actor.kind === 'person' ? await User.findByPk(ctx.actor.userId) : null;
  return sequelize.transaction(async (transaction) => {
    const token = await MachineToken.create(
      { name: input.name, tokenSha256: machineTokenSha256(value), createdByUserId: creator?.id ?? null, lastUsedAt: null, revokedAt: null },
      { transaction },
    );
    const dto = machineTokenDto(token, creator);
    await recordAudit(transaction, { ...ctx, action: 'machine-token.create', entityType: 'machine-token', entityId: token.id, after: dto });
    return { token: dto, value };
  });
}

/** Revokes a token at once (its next call gets 401); revoking a revoked token changes nothing. */
export async function revokeMachineToken(sequelize: Sequelize, ctx: AuditContext, id: number): Promise<MachineTokenDto> {
  return sequelize.transaction(async (transaction) => {
    const token = await MachineToken.findByPk(id, { include: [{ model: User, as: 'createdBy' }], transaction, lock: transaction.LOCK.UPDATE });
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
