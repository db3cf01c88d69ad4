import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type PrincipalKind = 'person' | 'machine';

/** One pushed text of a spec: number, sha256 of the text, the text, the parsed spec, who and when. */
export class SpecRevision extends Model<InferAttributes<SpecRevision>, InferCreationAttributes<SpecRevision>> {
  declare id: CreationOptional<number>;
  declare specId: number;
  declare number: number;
  declare sha256: string;
  declare yamlText: string;
  declare parsed: Record<string, unknown>;
  declare authorKind: PrincipalKind;
  declare authorId: number;
  declare authorName: string;
  declare createdAt: CreationOptional<Date>;
}

export function initSpecRevision(sequelize: Sequelize): void {
  SpecRevision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      specId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      yamlText: { type: DataTypes.TEXT('medium'), allowNull: false },
      parsed: { type: DataTypes.JSON, allowNull: false },
      authorKind: { type: DataTypes.ENUM('person', 'machine'), allowNull: false },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      authorName: { type: DataTypes.STRING(200), allowNull: false },
      createdAt: { type: DataTypes.DATE(3) },
    },
    { sequelize, tableName: 'spec_revisions', underscored: true, updatedAt: false },
  );
}
