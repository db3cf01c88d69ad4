import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** Files uploaded through the console; each becomes an upload job a worker picks up. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('uploads', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    size: { type: DataTypes.BIGINT, allowNull: false },
    spec_name: { type: DataTypes.STRING(100), allowNull: true },
    job_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'RESTRICT' },
    uploader_id: { type: DataTypes.INTEGER, allowNull: false },
    uploader_name: { type: DataTypes.STRING(200), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('uploads', ['created_at'], { name: 'uploads_created_at' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('uploads');
};
