import { Op } from 'sequelize';
import type { ResetInput, SessionUser } from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';
import { hashPassword, verifyAgainstDummy, verifyPassword } from '../lib/passwords.ts';
import { newToken, sha256Hex } from '../lib/tokens.ts';
import { queueMail } from '../lib/mailer.ts';
import { passwordResetMail } from '../lib/mail-templates.ts';
import { PasswordToken, Session, User, sequelize } from '../models/index.ts';
import { toSessionUser } from './user-dto.ts';

const RESET_TTL_MS = 60 * 60 * 1000;

const badCredentials = () =>
  new AppError('UNAUTHENTICATED', 'That e-mail and password do not match an account. Check both and try again.');

/** Check an e-mail and password; the same answer for an unknown e-mail and a wrong password. */
export async function authenticate(email: string, password: string): Promise<SessionUser> {
  const user = await User.findOne({ where: { email } });
  if (!user?.passwordHash) {
    await verifyAgainstDummy(password);
    throw badCredentials();
  }
  if (!(await verifyPassword(user.passwordHash, password))) throw badCredentials();
  if (!user.isActive) {
    throw new AppError('FORBIDDEN', 'This account has been deactivated. Ask your administrator to reactivate it.');
  }
  await user.update({ lastSignInAt: new Date() });
  return toSessionUser(user);
}

/** The signed-in user behind a session, or null when the account is gone or deactivated. */
export async function findActiveSessionUser(id: number): Promise<SessionUser | null> {
  const user = await User.findByPk(id, { attributes: ['id', 'email', 'name', 'role', 'isActive'] });
  return user?.isActive ? toSessionUser(user) : null;
}

/** E-mail a one-time reset link to an active account; silent for unknown addresses. */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await User.findOne({ where: { email, isActive: true } });
  if (!user) return;
  const { token, tokenHash } = newToken();
  await sequelize.transaction(async (transaction) => {
    await PasswordToken.update(
      { usedAt: new Date() },
      { where: { userId: user.id, purpose: 'reset', usedAt: null }, transaction },
    );
    await PasswordToken.create(
      { userId: user.id, purpose: 'reset', tokenHash, expiresAt: new Date(Date.now() + RESET_TTL_MS), usedAt: null },
      { transaction },
    );
    await queueMail(passwordResetMail(user.email, user.name, token), transaction);
  });
}

/** Set a new password from a reset or invitation link; the link works once and every old session ends. */
export async function resetPassword({ token, password }: ResetInput): Promise<void> {
  const passwordHash = await hashPassword(password);
  await sequelize.transaction(async (transaction) => {
    const record = await PasswordToken.findOne({
      where: { tokenHash: sha256Hex(token) },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!record || record.usedAt) {
      throw new AppError('VALIDATION_FAILED', 'This link has already been used or is not valid. Ask for a new one.', {
        token: 'Link already used or not valid',
      });
    }
    if (record.expiresAt.getTime() < Date.now()) {
      const life = record.purpose === 'invite' ? '7 days' : '1 hour';
      throw new AppError('VALIDATION_FAILED', `This link has expired (links last ${life}). Ask for a new one.`, {
        token: 'Link expired',
      });
    }
    const user = await User.findByPk(record.userId, { transaction });
    if (!user?.isActive) {
      throw new AppError('VALIDATION_FAILED', 'This account has been deactivated. Ask your administrator.', {
        token: 'Account deactivated',
      });
    }
    await user.update({ passwordHash }, { transaction });
    await PasswordToken.update(
      { usedAt: new Date() },
      { where: { userId: user.id, usedAt: null, id: { [Op.ne]: -1 } }, transaction },
    );
    await Session.destroy({ where: { userId: user.id }, transaction });
  });
}

/** Ends every session of a user (all devices); returns how many there were. */
export async function signOutEverywhere(userId: number): Promise<number> {
  return Session.destroy({ where: { userId } });
}
