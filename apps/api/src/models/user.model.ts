import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { roles, type Role } from '@stringfield/shared';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare role: Role;
  /** argon2id hash; null until an invited user sets a password. */
  declare passwordHash: string | null;
  declare isActive: CreationOptional<boolean>;
  declare isDemo: CreationOptional<boolean>;
  declare lastSignInAt: Date | null;
  /** Mail categories the user turned off, comma-separated. */
  declare mailOptOut: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
        passwordHash: { type: DataTypes.STRING(255), allowNull: true },
        isActive: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        mailOptOut: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
