import type { Logger } from 'pino';
import { QueryTypes, type Sequelize } from 'sequelize';

const SEED_KEY = 'demo-seed';
const SEED_VERSION = '1';

/**
 * The demo seed: applied once per database (recorded in instance_settings). People, lists and the
 * sample specs are added here as those features land; runs are never seeded with numbers, they come
 * from the sample drop folder.
 */
export async function seedDemo(sequelize: Sequelize, logger: Logger): Promise<void> {
  const rows = await sequelize.query<{ value: string }>('SELECT value FROM instance_settings WHERE `key` = ?', {
    replacements: [SEED_KEY],
    type: QueryTypes.SELECT,
  });
  if (rows[0]?.value === SEED_VERSION) {
    logger.info('demo seed already applied');
    return;
  }
  await sequelize.query('REPLACE INTO instance_settings (`key`, value, updated_at) VALUES (?, ?, UTC_TIMESTAMP(3))', {
    replacements: [SEED_KEY, SEED_VERSION],
  });
  logger.info('demo seed applied');
}
