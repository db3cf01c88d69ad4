import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A run spec by name; its text lives in its revisions. */
export class Spec extends Model<InferAttributes<Spec>, InferCreationAttributes<Spec>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare latestNumber: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSpec(sequelize: Sequelize): void {
  Spec.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      latestNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: { type: DataTypes.DATE(3) },
      updatedAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'specs', underscored: true },
  );
}
