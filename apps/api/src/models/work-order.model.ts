import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { priorities, workOrderStatuses, type FaultCategory, type Priority, type WorkOrderStatus } from '@stringfield/shared';
import type { Site } from './site.model.ts';
import type { User } from './user.model.ts';

export class WorkOrder extends Model<InferAttributes<WorkOrder>, InferCreationAttributes<WorkOrder>> {
  declare id: CreationOptional<number>;
  declare number: string;
  declare siteId: number;
  declare faultCategory: FaultCategory;
  declare priority: Priority;
  declare title: string;
  declare description: string;
  declare source: string;
  declare status: WorkOrderStatus;
  declare reportedAt: Date;
  declare dueAt: Date;
  declare assigneeId: number | null;
  declare createdById: number;
  declare returnReason: CreationOptional<string | null>;
  declare cancelReason: CreationOptional<string | null>;
  declare dispatchedAt: CreationOptional<Date | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare signedOffAt: CreationOptional<Date | null>;
  declare returnCount: CreationOptional<number>;
  declare overdueNotifiedAt: CreationOptional<Date | null>;
  declare overdueClaim: CreationOptional<string | null>;
  declare pendingOfflineCount: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare site?: NonAttribute<Site>;
  declare assignee?: NonAttribute<User | null>;
  declare createdBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    WorkOrder.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        faultCategory: { type: DataTypes.STRING(32), allowNull: false },
        priority: { type: DataTypes.ENUM(...priorities), allowNull: false },
        title: { type: DataTypes.STRING(160), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false },
        source: { type: DataTypes.STRING(32), allowNull: false },
        status: { type: DataTypes.ENUM(...workOrderStatuses), allowNull: false },
        reportedAt: { type: DataTypes.DATE, allowNull: false },
        dueAt: { type: DataTypes.DATE, allowNull: false },
        assigneeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        returnReason: { type: DataTypes.TEXT, allowNull: true },
        cancelReason: { type: DataTypes.TEXT, allowNull: true },
        dispatchedAt: { type: DataTypes.DATE, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        signedOffAt: { type: DataTypes.DATE, allowNull: true },
        returnCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        overdueNotifiedAt: { type: DataTypes.DATE, allowNull: true },
        overdueClaim: { type: DataTypes.STRING(64), allowNull: true },
        pendingOfflineCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'work_orders', underscored: true },
    );
  }
}

/** A string on a ticket, with the symptom reported for it. */
export class WorkOrderString extends Model<InferAttributes<WorkOrderString>, InferCreationAttributes<WorkOrderString>> {
  declare workOrderId: number;
  declare stringId: number;
  declare symptom: string;
  /** The signed-off ticket this one repeats on the same string (within 90 days), if any. */
  declare repeatOfId: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize) {
    WorkOrderString.init(
      {
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        stringId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        symptom: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        repeatOfId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'work_order_strings', underscored: true, timestamps: false },
    );
  }
}

export const eventTypes = ['created', 'transition', 'assigned', 'updated', 'comment'] as const;

/** Append-only history of a ticket. */
export class WorkOrderEvent extends Model<InferAttributes<WorkOrderEvent>, InferCreationAttributes<WorkOrderEvent>> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare actorId: number | null;
  declare type: (typeof eventTypes)[number];
  declare fromStatus: WorkOrderStatus | null;
  declare toStatus: WorkOrderStatus | null;
  declare changes: string | null;
  declare comment: string | null;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    WorkOrderEvent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        type: { type: DataTypes.ENUM(...eventTypes), allowNull: false },
        fromStatus: { type: DataTypes.ENUM(...workOrderStatuses), allowNull: true },
        toStatus: { type: DataTypes.ENUM(...workOrderStatuses), allowNull: true },
        changes: { type: DataTypes.TEXT, allowNull: true },
        comment: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'work_order_events', underscored: true, updatedAt: false },
    );
  }
}

export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare authorId: number;
  declare body: string;
  declare mentions: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Comment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        workOrderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        mentions: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'comments', underscored: true },
    );
  }
}

export class SiteSlaHours extends Model<InferAttributes<SiteSlaHours>, InferCreationAttributes<SiteSlaHours>> {
  declare siteId: number;
  declare priority: Priority;
  declare hours: number;

  static initModel(sequelize: Sequelize) {
    SiteSlaHours.init(
      {
        siteId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        priority: { type: DataTypes.ENUM(...priorities), primaryKey: true },
        hours: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      },
      { sequelize, tableName: 'site_sla_hours', underscored: true, timestamps: false },
    );
  }
}
