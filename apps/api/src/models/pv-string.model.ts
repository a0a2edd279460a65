import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Inverter } from './inverter.model.ts';
import type { CombinerBox } from './combiner-box.model.ts';
import type { ModuleModel } from './module-model.model.ts';

/** A PV string: modules in series on one MPPT input of one inverter. */
export class PvString extends Model<InferAttributes<PvString>, InferCreationAttributes<PvString>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare inverterId: number;
  declare mpptInput: number;
  declare combinerBoxId: number | null;
  declare combinerPosition: number | null;
  declare label: string;
  declare moduleModelId: number;
  declare modulesInSeries: number;
  declare stringsInParallel: number;
  declare commissionedOn: string | null;
  declare notes: string;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare inverter?: NonAttribute<Inverter>;
  declare combinerBox?: NonAttribute<CombinerBox | null>;
  declare moduleModel?: NonAttribute<ModuleModel>;

  static initModel(sequelize: Sequelize) {
    PvString.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        inverterId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        mpptInput: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        combinerBoxId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        combinerPosition: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        label: { type: DataTypes.STRING(40), allowNull: false },
        moduleModelId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        modulesInSeries: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        stringsInParallel: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        commissionedOn: { type: DataTypes.DATEONLY, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'pv_strings', underscored: true },
    );
  }
}
