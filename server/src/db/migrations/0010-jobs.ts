import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** The job queue: reruns and uploads that workers on any host claim with a lease. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('jobs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.ENUM('rerun', 'upload'), allowNull: false },
    payload: { type: DataTypes.JSON, allowNull: false },
    state: { type: DataTypes.ENUM('queued', 'claimed', 'done', 'failed'), allowNull: false, defaultValue: 'queued' },
    claimed_by: { type: DataTypes.STRING(200), allowNull: true },
    claimed_at: { type: DataTypes.DATE(3), allowNull: true },
    lease_until: { type: DataTypes.DATE(3), allowNull: true },
    claim_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    outcome: { type: DataTypes.TEXT, allowNull: true },
    created_by: { type: DataTypes.STRING(200), allowNull: false },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('jobs', ['state', 'id'], { name: 'jobs_state_id' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('jobs');
};
