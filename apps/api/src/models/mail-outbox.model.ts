import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export const mailStatuses = ['pending', 'sent', 'failed'] as const;
export type MailStatus = (typeof mailStatuses)[number];

/** Every outgoing message is written here first, so a mail server that is down loses nothing. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare status: CreationOptional<MailStatus>;
  declare attempts: CreationOptional<number>;
  declare lastError: string | null;
  declare nextAttemptAt: CreationOptional<Date>;
  declare claimedBy: string | null;
  declare claimedUntil: Date | null;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MailOutbox.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(255), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: false },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.ENUM(...mailStatuses), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        lastError: { type: DataTypes.STRING(1000), allowNull: true },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        claimedBy: { type: DataTypes.STRING(64), allowNull: true },
        claimedUntil: { type: DataTypes.DATE, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'mail_outbox', underscored: true, freezeTableName: true },
    );
  }
}
