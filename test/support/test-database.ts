import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll } from 'vitest';
import { loadSettings, type Settings } from '../../server/src/config.js';
import { createMigrator } from '../../server/src/db/migrator.js';
import { createSequelize } from '../../server/src/db/sequelize.js';

export interface TestDatabase {
  settings: Settings;
  sequelize: Sequelize;
  /** Drops the database and closes the connections. */
  drop(): Promise<void>;
}

/**
 * A fresh database of its own on the test MariaDB that `npm test` started (its name starts with the
 * configured name, which the test user may create and drop). Migrated unless told otherwise.
 */
export async function createTestDatabase(options: { migrate?: boolean } = {}): Promise<TestDatabase> {
  const base = loadSettings();
  const name = `${base.database.name}_${randomBytes(4).toString('hex')}`;
  const admin = createSequelize(base.database);
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  const settings: Settings = { ...base, database: { ...base.database, name } };
  const sequelize = createSequelize(settings.database);
  if (options.migrate ?? true) await createMigrator(sequelize).up();
  return {
    settings,
    sequelize,
    async drop() {
      await sequelize.query(`DROP DATABASE \`${name}\``);
      await sequelize.close();
    },
  };
}

/**
 * A fresh database for the tests of the enclosing describe block (or file): created before them and
 * handed to `ready` (to keep it, make the app, add people), dropped after every other after-hook of
 * the block (vitest runs after-hooks last-registered first).
 */
export function useTestDatabase(ready: (db: TestDatabase) => Promise<void> | void, options: { migrate?: boolean } = {}): void {
  let made: TestDatabase | undefined;
  beforeAll(async () => {
    made = await createTestDatabase(options);
    await ready(made);
  });
  afterAll(async () => {
    await made?.drop();
  });
}
