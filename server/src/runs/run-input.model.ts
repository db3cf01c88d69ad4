import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One input file of a run, by checksum; its bytes live in the content-addressed store. */
export class RunInput extends Model<InferAttributes<RunInput>, InferCreationAttributes<RunInput>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare name: string;
  declare sha256: string;
  declare size: number;
}

export function initRunInput(sequelize: Sequelize): void {
  RunInput.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(255), allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      // BIGINT comes back from the mariadb driver as a string unless read through this getter.
      size: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get(this: RunInput): number {
          return Number(this.getDataValue('size'));
        },
      },
    },
    { sequelize, tableName: 'run_inputs', underscored: true, timestamps: false },
  );
}
