import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class CombinerBox extends Model<InferAttributes<CombinerBox>, InferCreationAttributes<CombinerBox>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare tag: string;
  declare fuseRatingA: number | null;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CombinerBox.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tag: { type: DataTypes.STRING(40), allowNull: false },
        fuseRatingA: { type: DataTypes.DOUBLE, allowNull: true },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'combiner_boxes', underscored: true },
    );
  }
}
