import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/**
 * Sessions as connect-session-sequelize keeps them (sid, expires, data), plus the signed-in user's id
 * so that deactivating a user can end every session of theirs.
 */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare sid: string;
  declare userId: number | null;
  declare expires: Date | null;
  declare data: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Session.init(
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        expires: { type: DataTypes.DATE, allowNull: true },
        data: { type: DataTypes.TEXT('medium'), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sessions', underscored: true },
    );
  }
}
