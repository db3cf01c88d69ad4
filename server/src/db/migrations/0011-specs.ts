import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** Run specs and their revisions: each push that changes the text makes a new numbered revision. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('specs', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    latest_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.createTable('spec_revisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    spec_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'specs', key: 'id' }, onDelete: 'RESTRICT' },
    number: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    yaml_text: { type: DataTypes.TEXT('medium'), allowNull: false },
    parsed: { type: DataTypes.JSON, allowNull: false },
    author_kind: { type: DataTypes.ENUM('person', 'machine'), allowNull: false },
    author_id: { type: DataTypes.INTEGER, allowNull: false },
    author_name: { type: DataTypes.STRING(200), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('spec_revisions', ['spec_id', 'number'], { unique: true, name: 'spec_revisions_spec_number' });
  await queryInterface.addIndex('spec_revisions', ['sha256'], { name: 'spec_revisions_sha256' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('spec_revisions');
  await queryInterface.dropTable('specs');
};
