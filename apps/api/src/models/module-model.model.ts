import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ModuleSpec } from '@stringfield/pv';

/** A module datasheet: the `ModuleSpec` fields of packages/pv plus maker, model and cell technology. */
export class ModuleModel extends Model<InferAttributes<ModuleModel>, InferCreationAttributes<ModuleModel>> {
  declare id: CreationOptional<number>;
  declare maker: string;
  declare model: string;
  declare cellTechnology: string;
  declare pmaxW: number;
  declare vocV: number;
  declare iscA: number;
  declare vmpV: number;
  declare impA: number;
  declare alphaIscPctPerC: number;
  declare betaVocPctPerC: number;
  declare gammaPmaxPctPerC: number;
  declare cellsInSeries: number;
  declare bypassDiodes: number;
  declare noctC: number | null;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  toSpec(): ModuleSpec {
    return {
      pmaxW: this.pmaxW,
      vocV: this.vocV,
      iscA: this.iscA,
      vmpV: this.vmpV,
      impA: this.impA,
      alphaIscPctPerC: this.alphaIscPctPerC,
      betaVocPctPerC: this.betaVocPctPerC,
      gammaPmaxPctPerC: this.gammaPmaxPctPerC,
      cellsInSeries: this.cellsInSeries,
      bypassDiodes: this.bypassDiodes,
      ...(this.noctC === null ? {} : { noctC: this.noctC }),
    };
  }

  static initModel(sequelize: Sequelize) {
    // A fresh definition per attribute: Sequelize annotates each definition object in place.
    const dbl = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    ModuleModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        maker: { type: DataTypes.STRING(80), allowNull: false },
        model: { type: DataTypes.STRING(80), allowNull: false },
        cellTechnology: { type: DataTypes.STRING(20), allowNull: false },
        pmaxW: dbl(),
        vocV: dbl(),
        iscA: dbl(),
        vmpV: dbl(),
        impA: dbl(),
        alphaIscPctPerC: dbl(),
        betaVocPctPerC: dbl(),
        gammaPmaxPctPerC: dbl(),
        cellsInSeries: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        bypassDiodes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        noctC: { type: DataTypes.DOUBLE, allowNull: true },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'module_models', underscored: true },
    );
  }
}
