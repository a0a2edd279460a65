import type { RequestHandler } from 'express';
import { can, roleLabels, type Action } from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';

/** Refuse with 401 when nobody is signed in. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
  next();
};

/** Refuse with 401 when signed out and 403 when the role may not take the action (from the permission table). */
export function requirePermission(action: Action): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
    if (!can(req.user.role, action)) {
      throw new AppError('FORBIDDEN', `This is not available to your role (${roleLabels[req.user.role]}).`);
    }
    next();
  };
}
