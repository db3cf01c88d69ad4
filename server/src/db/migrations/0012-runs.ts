import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

const RUN_STATES = ['received', 'computing', 'in-review', 'released', 'failed', 'superseded'] as const;
const ATTEMPT_STATES = ['received', 'computing', 'in-review', 'failed'] as const;

/** Runs, their attempts (a rerun is a new attempt of the same run) and their input files. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('runs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    spec_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'specs', key: 'id' }, onDelete: 'RESTRICT' },
    spec_revision_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'spec_revisions', key: 'id' }, onDelete: 'RESTRICT' },
    as_of: { type: DataTypes.DATEONLY, allowNull: false },
    state: { type: DataTypes.ENUM(...RUN_STATES), allowNull: false },
    attempt: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    actor_kind: { type: DataTypes.ENUM('person', 'machine'), allowNull: false },
    actor_id: { type: DataTypes.INTEGER, allowNull: false },
    actor_name: { type: DataTypes.STRING(200), allowNull: false },
    fingerprint: { type: DataTypes.TEXT, allowNull: false },
    fingerprint_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    failure_code: { type: DataTypes.STRING(64), allowNull: true },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    security_count: { type: DataTypes.INTEGER, allowNull: true },
    computing_at: { type: DataTypes.DATE(3), allowNull: true },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
    released_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('runs', ['spec_id', 'as_of'], { name: 'runs_spec_as_of' });
  await queryInterface.addIndex('runs', ['state', 'as_of'], { name: 'runs_state_as_of' });
  await queryInterface.createTable('run_attempts', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    number: { type: DataTypes.INTEGER, allowNull: false },
    state: { type: DataTypes.ENUM(...ATTEMPT_STATES), allowNull: false },
    job_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'jobs', key: 'id' }, onDelete: 'SET NULL' },
    actor_name: { type: DataTypes.STRING(200), allowNull: false },
    failure_code: { type: DataTypes.STRING(64), allowNull: true },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    security_count: { type: DataTypes.INTEGER, allowNull: true },
    started_at: { type: DataTypes.DATE(3), allowNull: false },
    computing_at: { type: DataTypes.DATE(3), allowNull: true },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
  });
  await queryInterface.addIndex('run_attempts', ['run_id', 'number'], { unique: true, name: 'run_attempts_run_number' });
  await queryInterface.createTable('run_inputs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(255), allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    size: { type: DataTypes.BIGINT, allowNull: false },
  });
  await queryInterface.addIndex('run_inputs', ['run_id', 'name'], { unique: true, name: 'run_inputs_run_name' });
  await queryInterface.addIndex('run_inputs', ['sha256'], { name: 'run_inputs_sha256' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('run_inputs');
  await queryInterface.dropTable('run_attempts');
  await queryInterface.dropTable('runs');
};
