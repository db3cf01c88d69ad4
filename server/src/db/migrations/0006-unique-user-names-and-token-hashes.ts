import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/**
 * One person per user name, one token per hash. (createTable does not turn a named `unique` option into
 * an index on MariaDB, so these are added explicitly.) The column collation makes user names unique
 * regardless of letter case.
 */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.addIndex('users', ['user_name'], { name: 'users_user_name_unique', unique: true });
  await queryInterface.addIndex('machine_tokens', ['token_sha256'], { name: 'machine_tokens_token_sha256_unique', unique: true });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.removeIndex('machine_tokens', 'machine_tokens_token_sha256_unique');
  await queryInterface.removeIndex('users', 'users_user_name_unique');
};
