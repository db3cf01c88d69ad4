import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../../test/support/test-database.js';
import { createMigrator } from '../migrator.js';
import { tablesAmong } from './migration-test-support.js';

const MINE = [
  'distribution_lists',
  'distribution_recipients',
  'idempotency_records',
  'jobs',
  'mail_messages',
  'releases',
  'run_attempts',
  'run_inputs',
  'run_results',
  'runs',
  'spec_revisions',
  'specs',
  'uploads',
];
const FIRST_OF_MINE = '0010-jobs';

const tables = (db: TestDatabase): Promise<string[]> => tablesAmong(db, MINE);

async function uniqueIndexes(db: TestDatabase): Promise<string[]> {
  const rows = await db.sequelize.query<{ i: string }>(
    "SELECT DISTINCT CONCAT(table_name, '.', index_name) AS i FROM information_schema.statistics WHERE table_schema = DATABASE() AND non_unique = 0 AND index_name <> 'PRIMARY' AND table_name IN (?) ORDER BY i",
    { replacements: [MINE], type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.i);
}

describe('migrations 0010–0017: jobs, specs, runs, results, uploads, lists, releases, mail', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
  }, { migrate: false });

  it('go up, down and up again, each down removing what its up made', async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.up();
    expect(await tables(db)).toEqual(MINE);
    const unique = await uniqueIndexes(db);
    expect(unique).toEqual(expect.arrayContaining(['idempotency_records.idempotency_records_scope_key', 'run_results.run_results_run_attempt_security', 'spec_revisions.spec_revisions_spec_number']));

    await migrator.down({ to: FIRST_OF_MINE });
    expect(await tables(db)).toEqual([]);

    await migrator.up();
    expect(await tables(db)).toEqual(MINE);
    expect(await uniqueIndexes(db)).toEqual(unique);
  });

  it('keeps one result row per run, attempt and security', async () => {
    const insert = (attempt: number) =>
      db.sequelize.query(
        "INSERT INTO run_results (run_id, attempt, security, status, flags, record) VALUES (?, ?, 'QZ1', 'ok', '', '{}')",
        { replacements: [1, attempt] },
      );
    await db.sequelize.query("INSERT INTO specs (id, name, latest_number, created_at, updated_at) VALUES (1, 's', 1, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))");
    await db.sequelize.query(
      "INSERT INTO spec_revisions (id, spec_id, number, sha256, yaml_text, parsed, author_kind, author_id, author_name, created_at) VALUES (1, 1, 1, REPEAT('a', 64), 'x', '{}', 'person', 1, 'p', UTC_TIMESTAMP(3))",
    );
    await db.sequelize.query(
      "INSERT INTO runs (id, spec_id, spec_revision_id, as_of, state, attempt, actor_kind, actor_id, actor_name, fingerprint, fingerprint_sha256, created_at, updated_at) VALUES (1, 1, 1, '2026-06-30', 'computing', 1, 'machine', 1, 'm', 'f', REPEAT('b', 64), UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))",
    );
    await insert(1);
    await insert(2);
    await expect(insert(1)).rejects.toBeInstanceOf(UniqueConstraintError);
  });
});
