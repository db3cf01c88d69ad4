import { ForeignKeyConstraintError, QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../../test/support/test-database.js';
import { createMigrator } from '../migrator.js';

const BEFORE = '0017-mail-messages';
const MINE = '0018-machine-token-owners';

async function ownerColumn(db: TestDatabase): Promise<{ nullable: string; type: string } | undefined> {
  const rows = await db.sequelize.query<{ nullable: string; type: string }>(
    "SELECT is_nullable AS nullable, data_type AS type FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'machine_tokens' AND column_name = 'owner_user_id'",
    { type: QueryTypes.SELECT },
  );
  return rows[0];
}

async function ownerForeignKeys(db: TestDatabase): Promise<string[]> {
  const rows = await db.sequelize.query<{ k: string }>(
    "SELECT CONCAT(constraint_name, ' -> ', referenced_table_name, '.', referenced_column_name) AS k FROM information_schema.key_column_usage WHERE table_schema = DATABASE() AND table_name = 'machine_tokens' AND column_name = 'owner_user_id' AND referenced_table_name IS NOT NULL",
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.k);
}

const insertToken = (db: TestDatabase, ownerUserId: number | null) =>
  db.sequelize.query(
    "INSERT INTO machine_tokens (name, token_sha256, owner_user_id, created_at, updated_at) VALUES ('probe', SHA2(RAND(), 256), ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))",
    { replacements: [ownerUserId] },
  );

describe('migration 0018: the owner of a machine token', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
  }, { migrate: false });

  it('adds a nullable owner column referencing users, removes it on down, and adds it again', async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.up({ to: BEFORE });
    expect(await ownerColumn(db)).toBeUndefined();

    await migrator.up({ to: MINE });
    expect(await ownerColumn(db)).toEqual({ nullable: 'YES', type: 'int' });
    expect(await ownerForeignKeys(db)).toEqual(['machine_tokens_owner_user_id_fk -> users.id']);

    await migrator.down({ to: MINE });
    expect(await ownerColumn(db)).toBeUndefined();
    expect(await ownerForeignKeys(db)).toEqual([]);

    await migrator.up({ to: MINE });
    expect(await ownerColumn(db)).toEqual({ nullable: 'YES', type: 'int' });
    expect(await ownerForeignKeys(db)).toEqual(['machine_tokens_owner_user_id_fk -> users.id']);
  });

  it('keeps tokens without an owner and refuses an owner who is not a person', async () => {
    await insertToken(db, null);
    await expect(insertToken(db, 424242)).rejects.toBeInstanceOf(ForeignKeyConstraintError);
  });
});
