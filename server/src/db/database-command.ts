// `node --import tsx server/src/db/database-command.ts migrate|rollback|status|seed`
// Used by the start script; settings come from config/default.yaml and the environment.
import { loadSettings } from '../config.js';
import { createLogger } from '../shared/logger.js';
import { createMigrator } from './migrator.js';
import { createSequelize } from './sequelize.js';
import { seedDemo } from './seed-demo.js';

const settings = loadSettings();
const logger = createLogger(settings.log.level, 'clinometer-db');
const sequelize = createSequelize(settings.database);
const migrator = createMigrator(sequelize);
const action = process.argv[2] ?? 'migrate';

try {
  if (action === 'migrate') {
    const applied = await migrator.up();
    logger.info({ applied: applied.map((m) => m.name) }, `migrations applied: ${applied.length}`);
  } else if (action === 'rollback') {
    const reverted = await migrator.down();
    logger.info({ reverted: reverted.map((m) => m.name) }, 'last migration rolled back');
  } else if (action === 'status') {
    const pending = await migrator.pending();
    process.stdout.write(`${JSON.stringify({ executed: (await migrator.executed()).map((m) => m.name), pending: pending.map((m) => m.name) })}\n`);
  } else if (action === 'seed') {
    await seedDemo(sequelize, logger);
  } else {
    throw new Error(`unknown action ${action}: use migrate, rollback, status or seed`);
  }
} catch (err) {
  logger.error({ err }, `database ${action} failed`);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
