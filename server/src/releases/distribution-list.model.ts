import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A named list of people who receive releases by e-mail. */
export class DistributionList extends Model<InferAttributes<DistributionList>, InferCreationAttributes<DistributionList>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class DistributionRecipient extends Model<InferAttributes<DistributionRecipient>, InferCreationAttributes<DistributionRecipient>> {
  declare id: CreationOptional<number>;
  declare listId: number;
  declare address: string;
  declare displayName: CreationOptional<string>;
}

export function initDistributionList(sequelize: Sequelize): void {
  DistributionList.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      description: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      createdAt: { type: DataTypes.DATE(3) },
      updatedAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'distribution_lists', underscored: true },
  );
  DistributionRecipient.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      listId: { type: DataTypes.INTEGER, allowNull: false },
      address: { type: DataTypes.STRING(254), allowNull: false },
      displayName: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    },
    { sequelize, tableName: 'distribution_recipients', underscored: true, timestamps: false },
  );
}
