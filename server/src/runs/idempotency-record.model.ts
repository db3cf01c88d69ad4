import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The answer given to a request with an Idempotency-Key, replayed when the same key comes again. */
export class IdempotencyRecord extends Model<InferAttributes<IdempotencyRecord>, InferCreationAttributes<IdempotencyRecord>> {
  declare id: CreationOptional<number>;
  declare scope: string;
  declare idempotencyKey: string;
  declare requestSha256: string;
  declare responseStatus: number;
  declare responseBody: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

export function initIdempotencyRecord(sequelize: Sequelize): void {
  IdempotencyRecord.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      scope: { type: DataTypes.STRING(100), allowNull: false },
      idempotencyKey: { type: DataTypes.STRING(200), allowNull: false },
      requestSha256: { type: DataTypes.CHAR(64), allowNull: false },
      responseStatus: { type: DataTypes.INTEGER, allowNull: false },
      responseBody: { type: DataTypes.JSON, allowNull: false },
      createdAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'idempotency_records', underscored: true, updatedAt: false },
  );
}
