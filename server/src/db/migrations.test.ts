import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createMigrator } from './migrator.js';

async function tableNames(db: TestDatabase): Promise<string[]> {
  const rows = await db.sequelize.query<{ name: string }>(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.name);
}

describe('migrations on the real MariaDB', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
  }, { migrate: false });

  it('applies every migration, rolls all of them back, and applies them again', async () => {
    const migrator = createMigrator(db.sequelize);
    const pendingBefore = (await migrator.pending()).map((m) => m.name);
    expect(pendingBefore.length).toBeGreaterThan(0);

    await migrator.up();
    expect(await migrator.pending()).toEqual([]);
    const migrated = await tableNames(db);
    expect(migrated).toContain('instance_settings');

    await migrator.down({ to: 0 });
    expect(await tableNames(db)).toEqual(['schema_migrations']);

    await migrator.up();
    expect(await tableNames(db)).toEqual(migrated);
  });

  it('stores UTF-8 text beyond the basic plane in the utf8mb4 database', async () => {
    await db.sequelize.query('INSERT INTO instance_settings (`key`, value, updated_at) VALUES (?, ?, UTC_TIMESTAMP(3))', {
      replacements: ['probe', 'Ωmega 📈'],
    });
    const rows = await db.sequelize.query<{ value: string }>('SELECT value FROM instance_settings WHERE `key` = ?', {
      replacements: ['probe'],
      type: QueryTypes.SELECT,
    });
    expect(rows[0]?.value).toBe('Ωmega 📈');
  });
});
