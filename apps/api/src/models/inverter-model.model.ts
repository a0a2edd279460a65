import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class InverterModel extends Model<InferAttributes<InverterModel>, InferCreationAttributes<InverterModel>> {
  declare id: CreationOptional<number>;
  declare maker: string;
  declare model: string;
  declare maxDcV: number;
  declare mpptMinV: number;
  declare mpptMaxV: number;
  declare startV: number;
  declare mpptInputs: number;
  declare maxInputA: number;
  declare maxInputIscA: number;
  declare ratedAcW: number;
  declare maxDcW: number;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // A fresh definition per attribute: Sequelize annotates each definition object in place.
    const dbl = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    InverterModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        maker: { type: DataTypes.STRING(80), allowNull: false },
        model: { type: DataTypes.STRING(80), allowNull: false },
        maxDcV: dbl(),
        mpptMinV: dbl(),
        mpptMaxV: dbl(),
        startV: dbl(),
        mpptInputs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        maxInputA: dbl(),
        maxInputIscA: dbl(),
        ratedAcW: dbl(),
        maxDcW: dbl(),
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'inverter_models', underscored: true },
    );
  }
}
