import { Op, type Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { machineTokenSha256, newMachineTokenValue } from '../auth/machine-tokens.js';
import { DEMO_SEED_ACTOR } from './demo-people.js';
import { MachineToken } from './machine-token.model.js';
import { machineTokenDto } from './machine-tokens.service.js';
import { User } from './user.model.js';

export const DEMO_TOKEN_NAME = 'demo-watcher';
const MIN_LENGTH = 24;

export type DemoTokenOutcome = { kind: 'unchanged' } | { kind: 'created'; generatedValue?: string };

/**
 * Makes sure the demo watcher has a working machine token. With a value given (the start script's
 * CLINO_DEMO_MACHINE_TOKEN) that exact value works afterwards and earlier demo-watcher tokens are
 * revoked; without one, a random token is made once and its value returned to be shown once.
 */
export async function ensureDemoMachineToken(sequelize: Sequelize, value: string): Promise<DemoTokenOutcome> {
  if (value !== '' && value.length < MIN_LENGTH) throw new Error(`CLINO_DEMO_MACHINE_TOKEN: use at least ${MIN_LENGTH} characters`);
  if (value === '' && (await MachineToken.findOne({ where: { name: DEMO_TOKEN_NAME, revokedAt: null } }))) return { kind: 'unchanged' };
  const plain = value === '' ? newMachineTokenValue() : value;
  const tokenSha256 = machineTokenSha256(plain);
  const existing = await MachineToken.findOne({ where: { tokenSha256 } });
  if (existing && !existing.revokedAt) return { kind: 'unchanged' };
  const admin = await User.findOne({ where: { role: 'admin', active: true }, order: [['id', 'ASC']] });
  await sequelize.transaction(async (transaction) => {
    const stale = await MachineToken.findAll({ where: { name: DEMO_TOKEN_NAME, revokedAt: null, id: { [Op.ne]: existing?.id ?? 0 } }, transaction });
    for (const token of stale) {
      const before = machineTokenDto(token, null);
      await token.update({ revokedAt: new Date() }, { transaction });
      await recordAudit(transaction, { actor: DEMO_SEED_ACTOR, action: 'machine-token.revoke', entityType: 'machine-token', entityId: token.id, before, after: machineTokenDto(token, null) });
    }
    const token = existing
      ? await existing.update({ name: DEMO_TOKEN_NAME, revokedAt: null }, { transaction })
      : await MachineToken.create({ name: DEMO_TOKEN_NAME, tokenSha256, createdByUserId: admin?.id ?? null, lastUsedAt: null, revokedAt: null }, { transaction });
    await recordAudit(transaction, { actor: DEMO_SEED_ACTOR, action: existing ? 'machine-token.restore' : 'machine-token.create', entityType: 'machine-token', entityId: token.id, after: machineTokenDto(token, admin) });
  });
  return value === '' ? { kind: 'created', generatedValue: plain } : { kind: 'created' };
}
