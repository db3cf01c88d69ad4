import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { useTestDatabase, type TestDatabase } from '../../../../test/support/test-database.js';
import { initSessionRecord, SESSION_MODEL_NAME } from '../../auth/session-record.model.js';
import { createMigrator } from '../migrator.js';
import { tablesAmong } from './migration-test-support.js';

const MINE = ['audit_events', 'machine_tokens', 'sessions', 'users'];
const LAST_OF_MINE = '0006-unique-user-names-and-token-hashes';

const tables = (db: TestDatabase): Promise<string[]> => tablesAmong(db, MINE);

async function uniqueIndexes(db: TestDatabase): Promise<string[]> {
  const rows = await db.sequelize.query<{ t: string; c: string }>(
    "SELECT table_name AS t, column_name AS c FROM information_schema.statistics WHERE table_schema = DATABASE() AND non_unique = 0 AND index_name <> 'PRIMARY' AND table_name IN (?) ORDER BY t, c",
    { replacements: [MINE], type: QueryTypes.SELECT },
  );
  return rows.map((r) => `${r.t}.${r.c}`);
}

describe('migrations 0002–0006: people, machine tokens, sessions, audit events', () => {
  let db: TestDatabase;
  useTestDatabase(async (made) => {
    db = made;
  }, { migrate: false });

  it('go up, down and up again, each down removing what its up made', async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.up({ to: LAST_OF_MINE });
    expect(await tables(db)).toEqual(MINE);
    expect(await uniqueIndexes(db)).toEqual(['machine_tokens.token_sha256', 'users.user_name']);

    await migrator.down({ to: '0006-unique-user-names-and-token-hashes' });
    expect(await uniqueIndexes(db)).toEqual([]);
    await migrator.down({ to: '0002-users' });
    expect(await tables(db)).toEqual([]);

    await migrator.up({ to: LAST_OF_MINE });
    expect(await tables(db)).toEqual(MINE);
    expect(await uniqueIndexes(db)).toEqual(['machine_tokens.token_sha256', 'users.user_name']);
  });

  it('treats user names that differ only in letter case as the same name', async () => {
    const insert = (name: string) =>
      db.sequelize.query(
        "INSERT INTO users (user_name, display_name, email, role, password_hash, active, created_at, updated_at) VALUES (?, 'X', 'x@test.invalid', 'viewer', 'h', 1, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))",
        { replacements: [name] },
      );
    await insert('quinn.case');
    await expect(insert('Quinn.Case')).rejects.toBeInstanceOf(UniqueConstraintError);
  });

  it('gives connect-session-sequelize 7 the table it reads and writes', async () => {
    initSessionRecord(db.sequelize);
    const Store = connectSessionSequelize(session.Store);
    const store = new Store({ db: db.sequelize, table: SESSION_MODEL_NAME, checkExpirationInterval: 0 });
    const data = { cookie: { originalMaxAge: 60_000, expires: new Date(Date.now() + 60_000) }, csrfToken: 'probe' };
    await new Promise<void>((resolve, reject) => store.set('sid-probe', data as unknown as session.SessionData, (err) => (err ? reject(err) : resolve())));
    const read = await new Promise<session.SessionData | null | undefined>((resolve, reject) => store.get('sid-probe', (err, s) => (err ? reject(err) : resolve(s))));
    expect(read?.csrfToken).toBe('probe');
    await new Promise<void>((resolve, reject) => store.destroy('sid-probe', (err) => (err ? reject(err) : resolve())));
    expect(await db.sequelize.query('SELECT sid FROM sessions', { type: QueryTypes.SELECT })).toEqual([]);
  });
});
