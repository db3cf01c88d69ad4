import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ACTOR_KINDS = ['person', 'machine', 'system', 'anonymous'] as const;
export type ActorKind = (typeof ACTOR_KINDS)[number];

/** One line of the audit trail. Inserted only, never updated or deleted. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare occurredAt: Date;
  declare actorKind: ActorKind;
  declare actorId: number | null;
  declare actorName: string;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare beforeState: unknown;
  declare afterState: unknown;
  declare requestId: string | null;
}

export function initAuditEvent(sequelize: Sequelize): void {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      occurredAt: { type: DataTypes.DATE(3), allowNull: false },
      actorKind: { type: DataTypes.ENUM(...ACTOR_KINDS), allowNull: false },
      actorId: { type: DataTypes.INTEGER, allowNull: true },
      actorName: { type: DataTypes.STRING(200), allowNull: false },
      action: { type: DataTypes.STRING(64), allowNull: false },
      entityType: { type: DataTypes.STRING(64), allowNull: false },
      entityId: { type: DataTypes.STRING(100), allowNull: true },
      beforeState: { type: DataTypes.JSON, allowNull: true },
      afterState: { type: DataTypes.JSON, allowNull: true },
      requestId: { type: DataTypes.STRING(64), allowNull: true },
    },
    { sequelize, tableName: 'audit_events', modelName: 'AuditEvent', underscored: true, timestamps: false },
  );
}
