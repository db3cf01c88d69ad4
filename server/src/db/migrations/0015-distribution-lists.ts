import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** Who receives a release by e-mail: named lists of recipients. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('distribution_lists', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    description: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.createTable('distribution_recipients', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    list_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'distribution_lists', key: 'id' }, onDelete: 'CASCADE' },
    address: { type: DataTypes.STRING(254), allowNull: false },
    display_name: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
  });
  await queryInterface.addIndex('distribution_recipients', ['list_id', 'address'], { unique: true, name: 'distribution_recipients_list_address' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('distribution_recipients');
  await queryInterface.dropTable('distribution_lists');
};
