import { Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import type { Settings } from '../config.js';

/** The one Sequelize instance of a process (tests make their own per database). */
export function createSequelize(database: Settings['database'], logger?: Logger): Sequelize {
  return new Sequelize(database.name, database.user, database.password, {
    host: database.host,
    port: database.port,
    dialect: 'mariadb',
    logging: logger ? (sql: string) => logger.trace({ sql }, 'sql') : false,
    dialectOptions: { connectTimeout: 5000 },
    timezone: '+00:00',
    define: { underscored: true, charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
    pool: { max: 10, min: 0, idle: 10_000 },
  });
}

/** Whether the database answers a trivial query. */
export async function databaseReachable(sequelize: Sequelize): Promise<boolean> {
  try {
    await sequelize.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
