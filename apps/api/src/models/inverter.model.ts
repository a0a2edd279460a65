import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { InverterModel } from './inverter-model.model.ts';

export class Inverter extends Model<InferAttributes<Inverter>, InferCreationAttributes<Inverter>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare tag: string;
  declare inverterModelId: number;
  declare serial: string;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare inverterModel?: NonAttribute<InverterModel>;

  static initModel(sequelize: Sequelize) {
    Inverter.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tag: { type: DataTypes.STRING(40), allowNull: false },
        inverterModelId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        serial: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'inverters', underscored: true },
    );
  }
}
