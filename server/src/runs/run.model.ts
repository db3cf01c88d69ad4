import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PrincipalKind } from '../specs/spec-revision.model.js';

export const RUN_STATES = ['received', 'computing', 'in-review', 'released', 'failed', 'superseded'] as const;
export type RunState = (typeof RUN_STATES)[number];

/** One run of a spec revision on one as-of date and one set of inputs; reruns are its attempts. */
export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<number>;
  declare specId: number;
  declare specRevisionId: number;
  declare asOf: string;
  declare state: RunState;
  declare attempt: CreationOptional<number>;
  declare actorKind: PrincipalKind;
  declare actorId: number;
  declare actorName: string;
  declare fingerprint: string;
  declare fingerprintSha256: string;
  declare failureCode: CreationOptional<string | null>;
  declare failureMessage: CreationOptional<string | null>;
  declare securityCount: CreationOptional<number | null>;
  declare computingAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare releasedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initRun(sequelize: Sequelize): void {
  Run.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      specId: { type: DataTypes.INTEGER, allowNull: false },
      specRevisionId: { type: DataTypes.INTEGER, allowNull: false },
      asOf: { type: DataTypes.DATEONLY, allowNull: false },
      state: { type: DataTypes.ENUM(...RUN_STATES), allowNull: false },
      attempt: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      actorKind: { type: DataTypes.ENUM('person', 'machine'), allowNull: false },
      actorId: { type: DataTypes.INTEGER, allowNull: false },
      actorName: { type: DataTypes.STRING(200), allowNull: false },
      fingerprint: { type: DataTypes.TEXT, allowNull: false },
      fingerprintSha256: { type: DataTypes.CHAR(64), allowNull: false },
      failureCode: { type: DataTypes.STRING(64), allowNull: true },
      failureMessage: { type: DataTypes.TEXT, allowNull: true },
      securityCount: { type: DataTypes.INTEGER, allowNull: true },
      computingAt: { type: DataTypes.DATE(3), allowNull: true },
      finishedAt: { type: DataTypes.DATE(3), allowNull: true },
      releasedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: { type: DataTypes.DATE(3) },
      updatedAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'runs', underscored: true },
  );
}
