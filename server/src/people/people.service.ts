import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { recordAudit, type AuditContext } from '../audit/audit.service.js';
import { endSessionsOf } from '../auth/end-sessions.js';
import { hashPassword } from '../auth/passwords.js';
import { AppError, NotFoundError } from '../shared/errors.js';
import type { CreatePersonInput, PersonDto, UpdatePersonInput } from './people.schemas.js';
import { User } from './user.model.js';

export function personDto(user: User): PersonDto {
  return {
    id: user.id,
    userName: user.userName,
    displayName: user.displayName,
    email: user.email,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    updatedAt: user.updatedAt.toISOString(),
  };
}

export async function listPeople(): Promise<PersonDto[]> {
  const users = await User.findAll({ order: [['userName', 'ASC']] });
  return users.map(personDto);
}

function userNameTaken(userName: string): AppError {
  return new AppError(409, 'CONFLICT', `The user name ${userName} is taken`, { issues: [{ in: 'body', path: 'userName', message: 'taken' }] });
}

export async function createPerson(sequelize: Sequelize, ctx: AuditContext, input: CreatePersonInput, hashRounds: number): Promise<PersonDto> {
  const passwordHash = await hashPassword(input.password, hashRounds);
  try {
    return await sequelize.transaction(async (transaction) => {
      const user = await User.create({ userName: input.userName, displayName: input.displayName, email: input.email, role: input.role, passwordHash }, { transaction });
      const after = personDto(user);
      await recordAudit(transaction, { ...ctx, action: 'person.create', entityType: 'person', entityId: user.id, after });
      return after;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw userNameTaken(input.userName);
    throw err;
  }
}

/** At least one active admin must remain, or nobody could manage people and tokens again. */
async function keepAnAdmin(user: User, patch: UpdatePersonInput, transaction: Transaction): Promise<void> {
  const losesAdmin = user.role === 'admin' && user.active && ((patch.role !== undefined && patch.role !== 'admin') || patch.active === false);
  if (!losesAdmin) return;
  const activeAdmins = await User.findAll({ attributes: ['id'], where: { role: 'admin', active: true }, transaction, lock: transaction.LOCK.UPDATE });
  if (activeAdmins.length <= 1) throw new AppError(409, 'CONFLICT', 'This is the last active admin: make another person admin first');
}

/**
 * Changes a person's name, e-mail, role, active flag or password (an admin's reset). A deactivation or
 * a password reset ends the person's sessions. Audited: `person.update` and `person.password-reset`.
 */
export async function updatePerson(sequelize: Sequelize, ctx: AuditContext, id: number, patch: UpdatePersonInput, hashRounds: number): Promise<PersonDto> {
  const passwordHash = patch.password === undefined ? undefined : await hashPassword(patch.password, hashRounds);
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new NotFoundError(`No person with id ${id}`);
    await keepAnAdmin(user, patch, transaction);
    const before = personDto(user);
    const { password: _password, ...fields } = patch;
    const changes = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined));
    user.set(changes);
    if (passwordHash !== undefined) user.passwordHash = passwordHash;
    await user.save({ transaction });
    const after = personDto(user);
    if (Object.keys(changes).length > 0) await recordAudit(transaction, { ...ctx, action: 'person.update', entityType: 'person', entityId: id, before, after });
    if (passwordHash !== undefined) await recordAudit(transaction, { ...ctx, action: 'person.password-reset', entityType: 'person', entityId: id });
    if (passwordHash !== undefined || (before.active && !after.active)) await endSessionsOf(id, transaction);
    return after;
  });
}
