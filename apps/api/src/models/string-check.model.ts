import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare serial: string;
  declare model: string;
  declare calibrationDueOn: string;
  declare isArchived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Instrument.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.STRING(24), allowNull: false },
        serial: { type: DataTypes.STRING(80), allowNull: false },
        model: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
        calibrationDueOn: { type: DataTypes.DATEONLY, allowNull: false },
        isArchived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'instruments', underscored: true },
    );
  }
}

/** A saved string measurement with the verdict computed when it was saved; never edited in place. */
export class StringCheck extends Model<InferAttributes<StringCheck>, InferCreationAttributes<StringCheck>> {
  declare id: CreationOptional<number>;
  declare clientId: string;
  declare workOrderId: number;
  declare stringId: number;
  declare technicianId: number;
  declare phase: 'before' | 'after';
  declare takenAt: Date;
  declare vocV: number;
  declare iscA: number | null;
  declare operatingCurrentA: number | null;
  declare operatingVoltageV: number | null;
  declare irradianceWm2: number | null;
  declare irradianceMethod: string | null;
  declare moduleTempC: number | null;
  declare moduleTempMethod: string | null;
  declare ambientC: number | null;
  declare polarityCorrect: boolean;
  declare insulationPlusMOhm: number | null;
  declare insulationMinusMOhm: number | null;
  declare insulationTestVoltageV: number | null;
  declare instrumentIds: string;
  declare notes: string;
  declare expectedJson: string | null;
  declare vocDeviationPct: number | null;
  declare iscDeviationPct: number | null;
  declare verdict: 'pass' | 'attention' | 'fail';
  declare findingsJson: string;
  declare peersJson: string;
  declare isCalibrationOverdue: boolean;
  declare engineVersion: string;
  declare supersedesId: number | null;
  declare supersededById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    const dbl = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    StringCheck.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        clientId: { type: DataTypes.CHAR(36), allowNull: false, unique: true },
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        stringId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        technicianId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        phase: { type: DataTypes.ENUM('before', 'after'), allowNull: false },
        takenAt: { type: DataTypes.DATE(3), allowNull: false },
        vocV: { type: DataTypes.DOUBLE, allowNull: false },
        iscA: dbl(),
        operatingCurrentA: dbl(),
        operatingVoltageV: dbl(),
        irradianceWm2: dbl(),
        irradianceMethod: { type: DataTypes.STRING(24), allowNull: true },
        moduleTempC: dbl(),
        moduleTempMethod: { type: DataTypes.STRING(32), allowNull: true },
        ambientC: dbl(),
        polarityCorrect: { type: DataTypes.BOOLEAN, allowNull: false },
        insulationPlusMOhm: { ...dbl(), field: 'insulation_plus_mohm' },
        insulationMinusMOhm: { ...dbl(), field: 'insulation_minus_mohm' },
        insulationTestVoltageV: dbl(),
        instrumentIds: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        notes: { type: DataTypes.TEXT, allowNull: false },
        expectedJson: { type: DataTypes.TEXT, allowNull: true },
        vocDeviationPct: dbl(),
        iscDeviationPct: dbl(),
        verdict: { type: DataTypes.ENUM('pass', 'attention', 'fail'), allowNull: false },
        findingsJson: { type: DataTypes.TEXT, allowNull: false },
        peersJson: { type: DataTypes.TEXT, allowNull: false },
        isCalibrationOverdue: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
        supersedesId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        supersededById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'string_checks', underscored: true },
    );
  }
}

export class IvTrace extends Model<InferAttributes<IvTrace>, InferCreationAttributes<IvTrace>> {
  declare checkId: number;
  declare fileName: string;
  declare irradianceWm2: number;
  declare cellTempC: number;
  declare pointsJson: string;
  declare stcPointsJson: string;
  declare analysisJson: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    IvTrace.init(
      {
        checkId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        irradianceWm2: { type: DataTypes.DOUBLE, allowNull: false },
        cellTempC: { type: DataTypes.DOUBLE, allowNull: false },
        pointsJson: { type: DataTypes.TEXT('medium'), allowNull: false },
        stcPointsJson: { type: DataTypes.TEXT('medium'), allowNull: false },
        analysisJson: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'iv_traces', underscored: true },
    );
  }
}
