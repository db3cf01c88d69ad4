import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/**
 * One row per security and attempt: every result column as one JSON record (the contract's column
 * names), the columns the console sorts and filters on beside it, and the scatter points and
 * rolling betas as compact arrays, never one row per point. Posted results are kept with their
 * Idempotency-Key so the same post twice stores once and answers the same.
 */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('run_results', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    attempt: { type: DataTypes.INTEGER, allowNull: false },
    security: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    beta: { type: DataTypes.DOUBLE, allowNull: true },
    adjusted_beta: { type: DataTypes.DOUBLE, allowNull: true },
    r_squared: { type: DataTypes.DOUBLE, allowNull: true },
    expected_return: { type: DataTypes.DOUBLE, allowNull: true },
    flags: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    record: { type: DataTypes.JSON, allowNull: false },
    scatter: { type: DataTypes.JSON, allowNull: true },
    rolling: { type: DataTypes.JSON, allowNull: true },
  });
  await queryInterface.addIndex('run_results', ['run_id', 'attempt', 'security'], { unique: true, name: 'run_results_run_attempt_security' });
  await queryInterface.createTable('idempotency_records', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    scope: { type: DataTypes.STRING(100), allowNull: false },
    idempotency_key: { type: DataTypes.STRING(200), allowNull: false },
    request_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    response_status: { type: DataTypes.INTEGER, allowNull: false },
    response_body: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('idempotency_records', ['scope', 'idempotency_key'], { unique: true, name: 'idempotency_records_scope_key' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('idempotency_records');
  await queryInterface.dropTable('run_results');
};
