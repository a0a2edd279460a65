import type { SessionUser, User as UserDto } from '@stringfield/shared';
import type { User } from '../models/index.ts';

export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    isActive: u.isActive,
    hasPassword: u.passwordHash !== null,
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
    createdAt: u.createdAt.toISOString(),
  };
}

export function toSessionUser(u: Pick<User, 'id' | 'email' | 'name' | 'role'>): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}
