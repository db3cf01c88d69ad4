import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const JOB_KINDS = ['rerun', 'upload'] as const;
export type JobKind = (typeof JOB_KINDS)[number];
export const JOB_STATES = ['queued', 'claimed', 'done', 'failed'] as const;
export type JobState = (typeof JOB_STATES)[number];

/** A unit of work for a worker: rerun an attempt of a run, or process an uploaded file. */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<number>;
  declare kind: JobKind;
  declare payload: Record<string, unknown>;
  declare state: CreationOptional<JobState>;
  declare claimedBy: CreationOptional<string | null>;
  declare claimedAt: CreationOptional<Date | null>;
  declare leaseUntil: CreationOptional<Date | null>;
  declare claimCount: CreationOptional<number>;
  declare outcome: CreationOptional<string | null>;
  declare createdBy: string;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initJob(sequelize: Sequelize): void {
  Job.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.ENUM(...JOB_KINDS), allowNull: false },
      payload: { type: DataTypes.JSON, allowNull: false },
      state: { type: DataTypes.ENUM(...JOB_STATES), allowNull: false, defaultValue: 'queued' },
      claimedBy: { type: DataTypes.STRING(200), allowNull: true },
      claimedAt: { type: DataTypes.DATE(3), allowNull: true },
      leaseUntil: { type: DataTypes.DATE(3), allowNull: true },
      claimCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      outcome: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.STRING(200), allowNull: false },
      finishedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: { type: DataTypes.DATE(3) },
      updatedAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'jobs', underscored: true },
  );
}
