import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare code: string;
  declare address: string;
  declare timeZone: string;
  declare lowestAmbientC: number;
  declare highestAmbientC: number;
  declare designIrradianceWm2: number;
  declare peakSunHours: CreationOptional<number>;
  declare ownerContactEmail: string;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Site.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        code: { type: DataTypes.STRING(8), allowNull: false, unique: true },
        address: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        timeZone: { type: DataTypes.STRING(64), allowNull: false },
        lowestAmbientC: { type: DataTypes.DOUBLE, allowNull: false },
        highestAmbientC: { type: DataTypes.DOUBLE, allowNull: false },
        designIrradianceWm2: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1000 },
        peakSunHours: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 4.5 },
        ownerContactEmail: { type: DataTypes.STRING(254), allowNull: false },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sites', underscored: true },
    );
  }
}

/** Which owner accounts may see which sites. */
export class SiteOwner extends Model<InferAttributes<SiteOwner>, InferCreationAttributes<SiteOwner>> {
  declare siteId: number;
  declare userId: number;

  static initModel(sequelize: Sequelize) {
    SiteOwner.init(
      {
        siteId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      },
      { sequelize, tableName: 'site_owners', underscored: true, timestamps: false },
    );
  }
}
