import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** A release: the run's CSV as mailed (its bytes in the content store), who released it and to whom. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('releases', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'runs', key: 'id' }, onDelete: 'RESTRICT' },
    spec_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'specs', key: 'id' }, onDelete: 'RESTRICT' },
    as_of: { type: DataTypes.DATEONLY, allowNull: false },
    distribution_list_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'distribution_lists', key: 'id' }, onDelete: 'RESTRICT' },
    released_by_id: { type: DataTypes.INTEGER, allowNull: false },
    released_by_name: { type: DataTypes.STRING(200), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false },
    csv_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    csv_size: { type: DataTypes.INTEGER, allowNull: false },
    csv_name: { type: DataTypes.STRING(255), allowNull: false },
    fingerprint: { type: DataTypes.TEXT, allowNull: false },
    superseded_by_id: { type: DataTypes.INTEGER, allowNull: true },
    mail_state: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    mail_message_id: { type: DataTypes.STRING(255), allowNull: true },
    mail_error: { type: DataTypes.TEXT, allowNull: true },
    released_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('releases', ['spec_id', 'as_of'], { name: 'releases_spec_as_of' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('releases');
};
