import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';

/**
 * The audit trail: who (a person, a machine token, the system) did what to which entity, with the
 * entity's state before and after as JSON. Rows are only ever inserted.
 */
export const up: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    occurred_at: { type: DataTypes.DATE(3), allowNull: false },
    actor_kind: { type: DataTypes.ENUM('person', 'machine', 'system', 'anonymous'), allowNull: false },
    actor_id: { type: DataTypes.INTEGER, allowNull: true },
    actor_name: { type: DataTypes.STRING(200), allowNull: false },
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity_type: { type: DataTypes.STRING(64), allowNull: false },
    entity_id: { type: DataTypes.STRING(100), allowNull: true },
    before_state: { type: DataTypes.JSON, allowNull: true },
    after_state: { type: DataTypes.JSON, allowNull: true },
    request_id: { type: DataTypes.STRING(64), allowNull: true },
  });
  await queryInterface.addIndex('audit_events', ['occurred_at', 'id'], { name: 'audit_events_occurred_at' });
  await queryInterface.addIndex('audit_events', ['actor_name', 'occurred_at'], { name: 'audit_events_actor' });
  await queryInterface.addIndex('audit_events', ['action', 'occurred_at'], { name: 'audit_events_action' });
  await queryInterface.addIndex('audit_events', ['entity_type', 'entity_id', 'occurred_at'], { name: 'audit_events_entity' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('audit_events');
};
