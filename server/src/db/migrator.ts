import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from './migrations/index.js';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

/**
 * Schema changes only by migrations (never `sync`). The list is imported statically from
 * migrations/index.ts, so the same code runs under tsx, vitest and a bundler alike.
 */
export function createMigrator(sequelize: Sequelize): Umzug<MigrationContext> {
  return new Umzug<MigrationContext>({
    migrations: migrations.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
