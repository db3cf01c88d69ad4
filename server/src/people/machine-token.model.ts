import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user.model.js';

/**
 * A bearer token of the clino CLI. Only its sha256 is stored; its value is shown once, at creation.
 * A token with an owner acts for that person where authorship matters (a pushed spec revision).
 */
export class MachineToken extends Model<InferAttributes<MachineToken>, InferCreationAttributes<MachineToken>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare tokenSha256: string;
  declare createdByUserId: ForeignKey<User['id']> | null;
  declare ownerUserId: ForeignKey<User['id']> | null;
  declare lastUsedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;
  declare owner?: NonAttribute<User | null>;
}

export function initMachineToken(sequelize: Sequelize): void {
  MachineToken.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(100), allowNull: false },
      tokenSha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true, field: 'token_sha256' },
      lastUsedAt: { type: DataTypes.DATE(3), allowNull: true },
      revokedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'machine_tokens', modelName: 'MachineToken', underscored: true },
  );
}
