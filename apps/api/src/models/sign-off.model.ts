import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class SignOff extends Model<InferAttributes<SignOff>, InferCreationAttributes<SignOff>> {
  declare workOrderId: number;
  declare supervisorId: number;
  declare signedAt: Date;
  declare comment: string;
  declare overridesJson: string;
  declare digest: string;
  declare snapshotJson: string;
  declare lastEventId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignOff.init(
      {
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        supervisorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        signedAt: { type: DataTypes.DATE(3), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false },
        overridesJson: { type: DataTypes.TEXT, allowNull: false },
        digest: { type: DataTypes.CHAR(64), allowNull: false },
        snapshotJson: { type: DataTypes.TEXT('medium'), allowNull: false },
        lastEventId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sign_offs', underscored: true },
    );
  }
}
