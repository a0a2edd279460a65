import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare stringId: number | null;
  declare modulePosition: number | null;
  declare tag: 'before' | 'after' | 'thermal' | 'nameplate' | 'other';
  declare caption: string;
  declare originalKey: string;
  declare originalType: string;
  declare screenKey: string;
  declare thumbKey: string;
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare sha256: string;
  declare capturedAt: Date | null;
  declare gpsLat: number | null;
  declare gpsLon: number | null;
  declare uploadedById: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Photo.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        stringId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        modulePosition: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        tag: { type: DataTypes.ENUM('before', 'after', 'thermal', 'nameplate', 'other'), allowNull: false },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        originalKey: { type: DataTypes.STRING(200), allowNull: false },
        originalType: { type: DataTypes.STRING(40), allowNull: false },
        screenKey: { type: DataTypes.STRING(200), allowNull: false },
        thumbKey: { type: DataTypes.STRING(200), allowNull: false },
        width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        capturedAt: { type: DataTypes.DATE, allowNull: true },
        gpsLat: { type: DataTypes.DOUBLE, allowNull: true },
        gpsLon: { type: DataTypes.DOUBLE, allowNull: true },
        uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'photos', underscored: true },
    );
  }
}

export class ThermalFinding extends Model<InferAttributes<ThermalFinding>, InferCreationAttributes<ThermalFinding>> {
  declare photoId: number;
  declare hottestC: number;
  declare referenceC: number;
  declare irradianceWm2: number;
  declare pattern: string;
  declare modulePosition: number | null;
  declare classOfAbnormality: number | null;
  declare isConditionsTooPoor: boolean;
  declare reason: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ThermalFinding.init(
      {
        photoId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        hottestC: { type: DataTypes.DOUBLE, allowNull: false },
        referenceC: { type: DataTypes.DOUBLE, allowNull: false },
        irradianceWm2: { type: DataTypes.DOUBLE, allowNull: false },
        pattern: { type: DataTypes.STRING(24), allowNull: false },
        modulePosition: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        classOfAbnormality: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        isConditionsTooPoor: { type: DataTypes.BOOLEAN, allowNull: false },
        reason: { type: DataTypes.STRING(1000), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'thermal_findings', underscored: true },
    );
  }
}

export class DiodeReplacement extends Model<InferAttributes<DiodeReplacement>, InferCreationAttributes<DiodeReplacement>> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare stringId: number;
  declare modulePosition: number;
  declare moduleSerial: string;
  declare diodePosition: number;
  declare failureMode: string;
  declare foundBy: string;
  declare removedPartJson: string;
  declare installedPartJson: string;
  declare newDiodeForwardV: number | null;
  declare vocBeforeV: number | null;
  declare vocAfterV: number | null;
  declare beforePhotoId: number | null;
  declare afterPhotoId: number | null;
  declare notes: string;
  declare technicianId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DiodeReplacement.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        stringId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        modulePosition: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        moduleSerial: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
        diodePosition: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        failureMode: { type: DataTypes.STRING(20), allowNull: false },
        foundBy: { type: DataTypes.STRING(20), allowNull: false },
        removedPartJson: { type: DataTypes.TEXT, allowNull: false },
        installedPartJson: { type: DataTypes.TEXT, allowNull: false },
        newDiodeForwardV: { type: DataTypes.DOUBLE, allowNull: true },
        vocBeforeV: { type: DataTypes.DOUBLE, allowNull: true },
        vocAfterV: { type: DataTypes.DOUBLE, allowNull: true },
        beforePhotoId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        afterPhotoId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false },
        technicianId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'diode_replacements', underscored: true },
    );
  }
}
