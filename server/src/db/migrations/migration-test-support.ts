// Shared by the migration tests: what the database holds, read from information_schema.
import { QueryTypes } from 'sequelize';
import type { TestDatabase } from '../../../../test/support/test-database.js';

/** The tables of the current database among `names`, sorted. */
export async function tablesAmong(db: TestDatabase, names: readonly string[]): Promise<string[]> {
  const rows = await db.sequelize.query<{ name: string }>(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.name).filter((n) => names.includes(n)).sort();
}
