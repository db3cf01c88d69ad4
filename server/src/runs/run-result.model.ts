import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Scatter points of a security: the window's observations' excess returns, as parallel arrays. */
export interface ScatterSeries {
  market: number[];
  security: number[];
}

/** Rolling betas as parallel arrays: each window's last period, oldest first, and its beta (null when insufficient). */
export interface RollingSeries {
  periods: string[];
  betas: (number | null)[];
}

/** One security's result in one attempt of a run: one row, whatever the window length. */
export class RunResult extends Model<InferAttributes<RunResult>, InferCreationAttributes<RunResult>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare attempt: number;
  declare security: string;
  declare status: string;
  declare beta: number | null;
  declare adjustedBeta: number | null;
  declare rSquared: number | null;
  declare expectedReturn: number | null;
  declare flags: string;
  declare record: Record<string, string | number | null>;
  declare scatter: ScatterSeries | null;
  declare rolling: RollingSeries | null;
}

export function initRunResult(sequelize: Sequelize): void {
  RunResult.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false },
      attempt: { type: DataTypes.INTEGER, allowNull: false },
      security: { type: DataTypes.STRING(200), allowNull: false },
      status: { type: DataTypes.STRING(20), allowNull: false },
      beta: { type: DataTypes.DOUBLE, allowNull: true },
      adjustedBeta: { type: DataTypes.DOUBLE, allowNull: true },
      rSquared: { type: DataTypes.DOUBLE, allowNull: true },
      expectedReturn: { type: DataTypes.DOUBLE, allowNull: true },
      flags: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      record: { type: DataTypes.JSON, allowNull: false },
      scatter: { type: DataTypes.JSON, allowNull: true },
      rolling: { type: DataTypes.JSON, allowNull: true },
    },
    { sequelize, tableName: 'run_results', underscored: true, timestamps: false },
  );
}
