import type { Transaction } from 'sequelize';
import { SessionRecord } from './session-record.model.js';

/**
 * Ends every console session of a person (after a password reset or a deactivation). Passport keeps
 * the user id at `passport.user` in the session's JSON data. The JSON path goes in as a replacement:
 * Sequelize would escape its `$` inside a function call.
 */
export async function endSessionsOf(userId: number, transaction: Transaction): Promise<void> {
  const sequelize = SessionRecord.sequelize;
  if (!sequelize) throw new Error('initModels has not run');
  await sequelize.query('DELETE FROM sessions WHERE JSON_VALUE(data, ?) = ?', { replacements: ['$.passport.user', String(userId)], transaction });
}
