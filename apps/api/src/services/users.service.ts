import { Op, type Order, type WhereOptions } from 'sequelize';
import {
  roleLabels,
  type InviteUserInput,
  type Page,
  type PageQuery,
  type UpdateUserInput,
  type User as UserDto,
  type userListQuerySchema,
} from '@stringfield/shared';
import type { z } from 'zod';
import { AppError, notFound } from '../lib/app-error.ts';
import { newToken } from '../lib/tokens.ts';
import { queueMail } from '../lib/mailer.ts';
import { invitationMail } from '../lib/mail-templates.ts';
import { PasswordToken, Session, User, sequelize } from '../models/index.ts';
import { toUserDto } from './user-dto.ts';

const INVITE_TTL_MS = 7 * 24 * 60 * 60 * 1000;
type UserListQuery = z.infer<typeof userListQuerySchema> & PageQuery;

const sortColumns = { name: 'name', email: 'email', role: 'role', createdAt: 'createdAt' } as const;

export async function listUsers(q: UserListQuery): Promise<Page<UserDto>> {
  const where: WhereOptions<User>[] = [];
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push({ [Op.or]: [{ name: { [Op.like]: like } }, { email: { [Op.like]: like } }] });
  }
  if (q.role) where.push({ role: q.role });
  if (q.status !== 'all') where.push({ isActive: q.status === 'active' });
  const desc = q.sort.startsWith('-');
  const column = sortColumns[q.sort.replace(/^-/, '') as keyof typeof sortColumns];
  const order: Order = [[column, desc ? 'DESC' : 'ASC'], ['id', 'ASC']];
  const { rows, count } = await User.findAndCountAll({
    where: { [Op.and]: where },
    order,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map(toUserDto), total: count, page: q.page, pageSize: q.pageSize };
}

/** Create an account without a password and e-mail an invitation link to set one. */
export async function inviteUser(input: InviteUserInput): Promise<UserDto> {
  if (await User.findOne({ where: { email: input.email } })) {
    throw new AppError('CONFLICT', `A user with the e-mail ${input.email} already exists.`, {
      email: 'This e-mail already has an account',
    });
  }
  const { token, tokenHash } = newToken();
  return sequelize.transaction(async (transaction) => {
    const user = await User.create(
      { email: input.email, name: input.name, role: input.role, passwordHash: null, lastSignInAt: null },
      { transaction },
    );
    await PasswordToken.create(
      { userId: user.id, purpose: 'invite', tokenHash, expiresAt: new Date(Date.now() + INVITE_TTL_MS), usedAt: null },
      { transaction },
    );
    await queueMail(invitationMail(user.email, user.name, roleLabels[user.role], token), transaction);
    return toUserDto(user);
  });
}

/** Change a user's name, role or status; deactivating ends every session of theirs at once. */
export async function updateUser(id: number, input: UpdateUserInput, actingUserId: number): Promise<UserDto> {
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('That user');
    if (id === actingUserId && (input.isActive === false || (input.role && input.role !== 'admin'))) {
      throw new AppError('CONFLICT', 'You cannot deactivate yourself or take away your own administrator role.');
    }
    if (user.role === 'admin' && (input.isActive === false || (input.role && input.role !== 'admin'))) {
      const otherAdmins = await User.count({
        where: { role: 'admin', isActive: true, id: { [Op.ne]: id } },
        transaction,
      });
      if (otherAdmins === 0) throw new AppError('CONFLICT', 'Stringfield needs at least one active administrator.');
    }
    await user.update(input, { transaction });
    if (input.isActive === false || input.role !== undefined) {
      // A role change takes effect at the next sign-in; deactivation ends sessions immediately.
      await Session.destroy({ where: { userId: id }, transaction });
    }
    return toUserDto(user);
  });
}
