import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

const CONSTRAINT = 'machine_tokens_owner_user_id_fk';

/**
 * A machine token may belong to a person, its owner: a spec pushed with such a token is authored by
 * that person, so four eyes applies to it. Tokens without an owner (watchers, workers) stay as they are.
 */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.addColumn('machine_tokens', 'owner_user_id', { type: DataTypes.INTEGER, allowNull: true });
  await queryInterface.addConstraint('machine_tokens', {
    type: 'foreign key',
    name: CONSTRAINT,
    fields: ['owner_user_id'],
    references: { table: 'users', field: 'id' },
    onUpdate: 'CASCADE',
    onDelete: 'RESTRICT',
  });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.removeConstraint('machine_tokens', CONSTRAINT);
  await queryInterface.removeColumn('machine_tokens', 'owner_user_id');
};
