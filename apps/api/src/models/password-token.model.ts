import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export const passwordTokenPurposes = ['reset', 'invite'] as const;
export type PasswordTokenPurpose = (typeof passwordTokenPurposes)[number];

/** A one-time link for a password reset or an invitation; only the SHA-256 of the token is stored. */
export class PasswordToken extends Model<InferAttributes<PasswordToken>, InferCreationAttributes<PasswordToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare purpose: PasswordTokenPurpose;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PasswordToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        purpose: { type: DataTypes.ENUM(...passwordTokenPurposes), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'password_tokens', underscored: true },
    );
  }
}
