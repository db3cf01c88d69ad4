import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An attachment of a received message: its bytes live in the content store under `sha256`. */
export interface StoredAttachment {
  index: number;
  fileName: string;
  contentType: string;
  size: number;
  sha256: string;
}

/** A message the local mail sink received, for the Mailroom. */
export class MailMessage extends Model<InferAttributes<MailMessage>, InferCreationAttributes<MailMessage>> {
  declare id: CreationOptional<number>;
  declare messageId: string | null;
  declare envelopeFrom: string;
  declare envelopeTo: string[];
  declare fromHeader: string;
  declare toHeader: string;
  declare subject: string;
  declare textBody: string;
  declare attachments: StoredAttachment[];
  declare rawSha256: string;
  declare rawSize: number;
  declare receivedAt: Date;
}

export function initMailMessage(sequelize: Sequelize): void {
  MailMessage.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      messageId: { type: DataTypes.STRING(255), allowNull: true },
      envelopeFrom: { type: DataTypes.STRING(254), allowNull: false },
      envelopeTo: { type: DataTypes.JSON, allowNull: false },
      fromHeader: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      toHeader: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      textBody: { type: DataTypes.TEXT('medium'), allowNull: false },
      attachments: { type: DataTypes.JSON, allowNull: false },
      rawSha256: { type: DataTypes.CHAR(64), allowNull: false },
      rawSize: { type: DataTypes.INTEGER, allowNull: false },
      receivedAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'mail_messages', underscored: true, timestamps: false },
  );
}
