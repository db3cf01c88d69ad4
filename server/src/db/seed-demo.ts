import type { Logger } from 'pino';
import { QueryTypes, type Sequelize } from 'sequelize';
import { loadSettings, type Settings } from '../config.js';
import { DEMO_TOKEN_NAME, ensureDemoMachineToken } from '../people/demo-machine-token.js';
import { seedDemoPeople } from '../people/demo-people.js';
import { DEMO_LIST_NAME, ensureDemoDistributionList } from '../releases/demo-distribution-list.js';
import { initModels } from './init-models.js';

const SEED_KEY = 'demo-seed';
const SEED_VERSION = '2';

/**
 * The demo seed: applied once per database (recorded in instance_settings). People, lists and the
 * sample specs are added here as those features land; runs are never seeded with numbers, they come
 * from the sample drop folder. The demo watcher's machine token is checked on every call, since the
 * start script may hand it a new value (CLINO_DEMO_MACHINE_TOKEN).
 */
export async function seedDemo(sequelize: Sequelize, logger: Logger, auth: Settings['auth'] = loadSettings().auth): Promise<void> {
  initModels(sequelize);
  const rows = await sequelize.query<{ value: string }>('SELECT value FROM instance_settings WHERE `key` = ?', {
    replacements: [SEED_KEY],
    type: QueryTypes.SELECT,
  });
  if (rows[0]?.value === SEED_VERSION) {
    logger.info('demo seed already applied');
  } else {
    const people = await seedDemoPeople(sequelize, auth.passwordHashRounds);
    logger.info({ people }, `demo people created: ${people.length}`);
    await sequelize.query('REPLACE INTO instance_settings (`key`, value, updated_at) VALUES (?, ?, UTC_TIMESTAMP(3))', {
      replacements: [SEED_KEY, SEED_VERSION],
    });
    logger.info('demo seed applied');
  }
  if ((await ensureDemoDistributionList(sequelize)) === 'created') logger.info(`demo distribution list "${DEMO_LIST_NAME}" created`);
  const token = await ensureDemoMachineToken(sequelize, auth.demoMachineToken);
  if (token.kind === 'created' && token.generatedValue) {
    logger.info(`demo machine token "${DEMO_TOKEN_NAME}" created; its value (shown this once): ${token.generatedValue}`);
  } else if (token.kind === 'created') {
    logger.info(`demo machine token "${DEMO_TOKEN_NAME}" set from CLINO_DEMO_MACHINE_TOKEN`);
  }
}
