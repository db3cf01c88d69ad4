import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A price, market or risk-free file uploaded through the console; its bytes live in the store. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare originalName: string;
  declare fileName: string;
  declare contentType: string;
  declare sha256: string;
  declare size: number;
  declare specName: string | null;
  declare jobId: number;
  declare uploaderId: number;
  declare uploaderName: string;
  declare createdAt: CreationOptional<Date>;
}

export function initUpload(sequelize: Sequelize): void {
  Upload.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      fileName: { type: DataTypes.STRING(255), allowNull: false },
      contentType: { type: DataTypes.STRING(100), allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      size: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get(this: Upload): number {
          return Number(this.getDataValue('size'));
        },
      },
      specName: { type: DataTypes.STRING(100), allowNull: true },
      jobId: { type: DataTypes.INTEGER, allowNull: false },
      uploaderId: { type: DataTypes.INTEGER, allowNull: false },
      uploaderName: { type: DataTypes.STRING(200), allowNull: false },
      createdAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'uploads', underscored: true, updatedAt: false },
  );
}
