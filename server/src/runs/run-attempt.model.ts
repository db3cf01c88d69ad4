import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ATTEMPT_STATES = ['received', 'computing', 'in-review', 'failed'] as const;
export type AttemptState = (typeof ATTEMPT_STATES)[number];

/** One computation of a run: the first from ingest, later ones from rerun jobs. */
export class RunAttempt extends Model<InferAttributes<RunAttempt>, InferCreationAttributes<RunAttempt>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare number: number;
  declare state: AttemptState;
  declare jobId: CreationOptional<number | null>;
  declare actorName: string;
  declare failureCode: CreationOptional<string | null>;
  declare failureMessage: CreationOptional<string | null>;
  declare securityCount: CreationOptional<number | null>;
  declare startedAt: Date;
  declare computingAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
}

export function initRunAttempt(sequelize: Sequelize): void {
  RunAttempt.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.ENUM(...ATTEMPT_STATES), allowNull: false },
      jobId: { type: DataTypes.INTEGER, allowNull: true },
      actorName: { type: DataTypes.STRING(200), allowNull: false },
      failureCode: { type: DataTypes.STRING(64), allowNull: true },
      failureMessage: { type: DataTypes.TEXT, allowNull: true },
      securityCount: { type: DataTypes.INTEGER, allowNull: true },
      startedAt: { type: DataTypes.DATE(3), allowNull: false },
      computingAt: { type: DataTypes.DATE(3), allowNull: true },
      finishedAt: { type: DataTypes.DATE(3), allowNull: true },
    },
    { sequelize, tableName: 'run_attempts', underscored: true, timestamps: false },
  );
}
