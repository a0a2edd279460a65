import { sequelize } from '../lib/db.ts';
import { User } from './user.model.ts';
import { PasswordToken } from './password-token.model.ts';
import { Session } from './session.model.ts';
import { MailOutbox } from './mail-outbox.model.ts';
import { RateLimitHit } from './rate-limit-hit.model.ts';

User.initModel(sequelize);
PasswordToken.initModel(sequelize);
Session.initModel(sequelize);
MailOutbox.initModel(sequelize);
RateLimitHit.initModel(sequelize);

User.hasMany(PasswordToken, { foreignKey: 'userId', as: 'passwordTokens' });
PasswordToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });

export { sequelize, User, PasswordToken, Session, MailOutbox, RateLimitHit };
