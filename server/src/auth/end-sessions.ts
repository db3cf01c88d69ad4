import { Op, Sequelize, type Transaction } from 'sequelize';
import { SessionRecord } from './session-record.model.js';

/**
 * Ends every console session of a person (after a password reset or a deactivation). Passport keeps
 * the user id at `passport.user` in the session's JSON data.
 */
export async function endSessionsOf(userId: number, transaction: Transaction): Promise<number> {
  return SessionRecord.destroy({
    where: { [Op.and]: [Sequelize.where(Sequelize.fn('JSON_VALUE', Sequelize.col('data'), '$.passport.user'), String(userId))] },
    transaction,
  });
}
