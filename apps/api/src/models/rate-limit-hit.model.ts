import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Sign-in attempt counters, kept in MariaDB so that every API process counts against the same limit. */
export class RateLimitHit extends Model<InferAttributes<RateLimitHit>, InferCreationAttributes<RateLimitHit>> {
  declare key: string;
  declare hits: number;
  declare resetAt: Date;

  static initModel(sequelize: Sequelize) {
    RateLimitHit.init(
      {
        key: { type: DataTypes.STRING(255), primaryKey: true },
        hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        resetAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'rate_limit_hits', underscored: true, timestamps: false },
    );
  }
}
