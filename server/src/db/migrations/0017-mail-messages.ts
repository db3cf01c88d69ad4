import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/** Every message the local mail sink received (the Mailroom); raw message and attachments in the store. */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('mail_messages', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    message_id: { type: DataTypes.STRING(255), allowNull: true },
    envelope_from: { type: DataTypes.STRING(254), allowNull: false },
    envelope_to: { type: DataTypes.JSON, allowNull: false },
    from_header: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    to_header: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
    attachments: { type: DataTypes.JSON, allowNull: false },
    raw_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    raw_size: { type: DataTypes.INTEGER, allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('mail_messages', ['received_at'], { name: 'mail_messages_received_at' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('mail_messages');
};
