import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type MailState = 'pending' | 'sent' | 'failed';

/** A released run: the CSV exactly as mailed (bytes in the store), its fingerprint, who and to whom. */
export class Release extends Model<InferAttributes<Release>, InferCreationAttributes<Release>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare specId: number;
  declare asOf: string;
  declare distributionListId: number;
  declare releasedById: number;
  declare releasedByName: string;
  declare note: string;
  declare csvSha256: string;
  declare csvSize: number;
  declare csvName: string;
  declare fingerprint: string;
  declare supersededById: CreationOptional<number | null>;
  declare mailState: CreationOptional<MailState>;
  declare mailMessageId: CreationOptional<string | null>;
  declare mailError: CreationOptional<string | null>;
  declare releasedAt: Date;
}

export function initRelease(sequelize: Sequelize): void {
  Release.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      specId: { type: DataTypes.INTEGER, allowNull: false },
      asOf: { type: DataTypes.DATEONLY, allowNull: false },
      distributionListId: { type: DataTypes.INTEGER, allowNull: false },
      releasedById: { type: DataTypes.INTEGER, allowNull: false },
      releasedByName: { type: DataTypes.STRING(200), allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false },
      csvSha256: { type: DataTypes.CHAR(64), allowNull: false },
      csvSize: { type: DataTypes.INTEGER, allowNull: false },
      csvName: { type: DataTypes.STRING(255), allowNull: false },
      fingerprint: { type: DataTypes.TEXT, allowNull: false },
      supersededById: { type: DataTypes.INTEGER, allowNull: true },
      mailState: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      mailMessageId: { type: DataTypes.STRING(255), allowNull: true },
      mailError: { type: DataTypes.TEXT, allowNull: true },
      releasedAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'releases', underscored: true, timestamps: false },
  );
}
