import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The model name the session store is told to use (its `table` option), so it never defines its own. */
export const SESSION_MODEL_NAME = 'SessionRecord';

/** One console session, in the layout connect-session-sequelize 7 reads and writes. */
export class SessionRecord extends Model<InferAttributes<SessionRecord>, InferCreationAttributes<SessionRecord>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSessionRecord(sequelize: Sequelize): void {
  SessionRecord.init(
    {
      sid: { type: DataTypes.STRING(36), primaryKey: true },
      expires: { type: DataTypes.DATE(3), allowNull: true },
      data: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'sessions', modelName: SESSION_MODEL_NAME, underscored: true },
  );
}
