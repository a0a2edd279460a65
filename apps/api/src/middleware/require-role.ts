import type { RequestHandler } from 'express';
import { can, roleLabels, type Action } from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';

/** What a route asks of its caller; read back from the routes themselves by `routeTable` (lib/route-table.ts). */
export type RouteGuard = { kind: 'public' } | { kind: 'signed-in' } | { kind: 'permission'; action: Action };

const guards = new WeakMap<RequestHandler, RouteGuard>();
const tagged = (handler: RequestHandler, guard: RouteGuard): RequestHandler => {
  guards.set(handler, guard);
  return handler;
};

/** The guard a middleware stands for, if it is one of ours. */
export function guardOf(handler: unknown): RouteGuard | undefined {
  return typeof handler === 'function' ? guards.get(handler as RequestHandler) : undefined;
}

/** Marks a route as open to anyone (sign-in, password reset, health); it checks nothing. */
export const publicRoute: RequestHandler = tagged((_req, _res, next) => next(), { kind: 'public' });

/** Refuse with 401 when nobody is signed in. */
export const requireAuth: RequestHandler = tagged(
  (req, _res, next) => {
    if (!req.user) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
    next();
  },
  { kind: 'signed-in' },
);

/** Refuse with 401 when signed out and 403 when the role may not take the action (from the permission table). */
export function requirePermission(action: Action): RequestHandler {
  return tagged(
    (req, _res, next) => {
      if (!req.user) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
      if (!can(req.user.role, action)) {
        throw new AppError('FORBIDDEN', `This is not available to your role (${roleLabels[req.user.role]}).`);
      }
      next();
    },
    { kind: 'permission', action },
  );
}
