import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { DistributionList, DistributionRecipient } from './distribution-list.model.js';

export const DEMO_LIST_NAME = 'valuation-committee';

/** Invented recipients of the demo fund (the .invalid domain never delivers anywhere). */
export const DEMO_RECIPIENTS: readonly { address: string; displayName: string }[] = [
  { address: 'valuation.chair@demo-fund.invalid', displayName: 'Valuation committee chair' },
  { address: 'portfolio.desk@demo-fund.invalid', displayName: 'Portfolio managers' },
  { address: 'risk.office@demo-fund.invalid', displayName: 'Risk office' },
  { address: 'fund.accounting@demo-fund.invalid', displayName: 'Fund accounting' },
];

/** The demo's distribution list, created when missing (so the seed may run again safely). */
export async function ensureDemoDistributionList(sequelize: Sequelize): Promise<'created' | 'present'> {
  return sequelize.transaction(async (transaction) => {
    const existing = await DistributionList.findOne({ where: { name: DEMO_LIST_NAME }, transaction });
    if (existing) return 'present';
    const list = await DistributionList.create({ name: DEMO_LIST_NAME, description: 'Receives the month-end beta and cost-of-equity report.' }, { transaction });
    await DistributionRecipient.bulkCreate(DEMO_RECIPIENTS.map((r) => ({ listId: list.id, ...r })), { transaction });
    await recordAudit(transaction, {
      actor: { kind: 'system', name: 'demo seed' },
      action: 'distribution-list.create',
      entityType: 'distribution-list',
      entityId: list.id,
      after: { name: list.name, recipients: DEMO_RECIPIENTS.map((r) => r.address) },
    });
    return 'created';
  });
}
