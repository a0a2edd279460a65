import { sequelize } from '../lib/db.ts';
import { User } from './user.model.ts';
import { PasswordToken } from './password-token.model.ts';
import { Session } from './session.model.ts';
import { MailOutbox } from './mail-outbox.model.ts';
import { RateLimitHit } from './rate-limit-hit.model.ts';
import { Site, SiteOwner } from './site.model.ts';
import { ModuleModel } from './module-model.model.ts';
import { InverterModel } from './inverter-model.model.ts';
import { Inverter } from './inverter.model.ts';
import { CombinerBox } from './combiner-box.model.ts';
import { PvString } from './pv-string.model.ts';
import { Instrument, IvTrace, StringCheck } from './string-check.model.ts';
import { DiodeReplacement, Photo, ThermalFinding } from './evidence.model.ts';
import { SignOff } from './sign-off.model.ts';
import { Comment, SiteSlaHours, WorkOrder, WorkOrderEvent, WorkOrderString } from './work-order.model.ts';

for (const model of [User, PasswordToken, Session, MailOutbox, RateLimitHit, Site, SiteOwner, ModuleModel, InverterModel, Inverter, CombinerBox, PvString, WorkOrder, WorkOrderString, WorkOrderEvent, Comment, SiteSlaHours, Instrument, StringCheck, IvTrace, Photo, ThermalFinding, DiodeReplacement, SignOff]) {
  model.initModel(sequelize);
}

User.hasMany(PasswordToken, { foreignKey: 'userId', as: 'passwordTokens' });
PasswordToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });

Site.hasMany(Inverter, { foreignKey: 'siteId', as: 'inverters' });
Inverter.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
Inverter.belongsTo(InverterModel, { foreignKey: 'inverterModelId', as: 'inverterModel' });
Site.hasMany(CombinerBox, { foreignKey: 'siteId', as: 'combinerBoxes' });
Site.hasMany(PvString, { foreignKey: 'siteId', as: 'strings' });
PvString.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
PvString.belongsTo(Inverter, { foreignKey: 'inverterId', as: 'inverter' });
PvString.belongsTo(CombinerBox, { foreignKey: 'combinerBoxId', as: 'combinerBox' });
PvString.belongsTo(ModuleModel, { foreignKey: 'moduleModelId', as: 'moduleModel' });
Site.hasMany(SiteOwner, { foreignKey: 'siteId', as: 'owners' });

WorkOrder.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
WorkOrder.belongsTo(User, { foreignKey: 'assigneeId', as: 'assignee' });
WorkOrder.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
WorkOrder.hasMany(WorkOrderString, { foreignKey: 'workOrderId', as: 'strings' });
WorkOrderString.belongsTo(PvString, { foreignKey: 'stringId', as: 'string' });
WorkOrder.hasMany(WorkOrderEvent, { foreignKey: 'workOrderId', as: 'events' });
WorkOrderEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
WorkOrder.hasMany(Comment, { foreignKey: 'workOrderId', as: 'comments' });

export {
  sequelize,
  User,
  PasswordToken,
  Session,
  MailOutbox,
  RateLimitHit,
  Site,
  SiteOwner,
  ModuleModel,
  InverterModel,
  Inverter,
  CombinerBox,
  PvString,
  WorkOrder,
  WorkOrderString,
  WorkOrderEvent,
  Comment,
  SiteSlaHours,
  Instrument,
  StringCheck,
  IvTrace,
  Photo,
  ThermalFinding,
  DiodeReplacement,
  SignOff,
};
