import { type Sequelize, type Transaction, UniqueConstraintError } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import type { Actor } from '../runs/actor.js';
import { AppError, NotFoundError } from '../shared/errors.js';
import { DistributionList, DistributionRecipient } from './distribution-list.model.js';
import type { DistributionListBody } from './distribution-lists.schemas.js';

export interface DistributionListView {
  id: string;
  name: string;
  description: string;
  recipients: { address: string; displayName: string }[];
  updatedAt: string;
}

async function viewOf(list: DistributionList, transaction?: Transaction): Promise<DistributionListView> {
  const recipients = await DistributionRecipient.findAll({ where: { listId: list.id }, order: [['address', 'ASC']], transaction });
  return {
    id: String(list.id),
    name: list.name,
    description: list.description,
    recipients: recipients.map((r) => ({ address: r.address, displayName: r.displayName })),
    updatedAt: list.updatedAt.toISOString(),
  };
}

export async function listDistributionLists(): Promise<DistributionListView[]> {
  const lists = await DistributionList.findAll({ order: [['name', 'ASC']] });
  return Promise.all(lists.map((list) => viewOf(list)));
}

/** The list by name with its recipients, or null. */
export async function distributionListNamed(name: string, transaction?: Transaction): Promise<DistributionListView | null> {
  const list = await DistributionList.findOne({ where: { name }, transaction });
  return list ? viewOf(list, transaction) : null;
}

function nameTaken(error: unknown, name: string): unknown {
  return error instanceof UniqueConstraintError ? new AppError(409, 'CONFLICT', `A distribution list named ${name} already exists`) : error;
}

async function replaceRecipients(list: DistributionList, body: DistributionListBody, transaction: Transaction): Promise<void> {
  await DistributionRecipient.destroy({ where: { listId: list.id }, transaction });
  await DistributionRecipient.bulkCreate(body.recipients.map((r) => ({ listId: list.id, address: r.address, displayName: r.displayName })), { transaction });
}

export async function createDistributionList(sequelize: Sequelize, actor: Actor, body: DistributionListBody, requestId: string | null): Promise<DistributionListView> {
  try {
    return await sequelize.transaction(async (transaction) => {
      const list = await DistributionList.create({ name: body.name, description: body.description }, { transaction });
      await replaceRecipients(list, body, transaction);
      const view = await viewOf(list, transaction);
      await recordAudit(transaction, { actor: actor.principal, action: 'distribution-list.create', entityType: 'distribution-list', entityId: list.id, after: view, requestId });
      return view;
    });
  } catch (error) {
    throw nameTaken(error, body.name);
  }
}

export async function updateDistributionList(sequelize: Sequelize, actor: Actor, id: number, body: DistributionListBody, requestId: string | null): Promise<DistributionListView> {
  try {
    return await sequelize.transaction(async (transaction) => {
      const list = await DistributionList.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!list) throw new NotFoundError(`No distribution list ${id}`);
      const before = await viewOf(list, transaction);
      await list.update({ name: body.name, description: body.description }, { transaction });
      await replaceRecipients(list, body, transaction);
      const after = await viewOf(list, transaction);
      await recordAudit(transaction, { actor: actor.principal, action: 'distribution-list.update', entityType: 'distribution-list', entityId: list.id, before, after, requestId });
      return after;
    });
  } catch (error) {
    throw nameTaken(error, body.name);
  }
}
