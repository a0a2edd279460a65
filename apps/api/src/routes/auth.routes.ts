import { Router, type Request } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { loginInputSchema, resetInputSchema, resetRequestInputSchema } from '@stringfield/shared';
import { env } from '../config/env.ts';
import { AppError } from '../lib/app-error.ts';
import { publicRoute, requireAuth } from '../middleware/require-role.ts';
import { MariaDbRateLimitStore } from '../middleware/rate-limit-store.ts';
import { authenticate, requestPasswordReset, resetPassword, signOutEverywhere } from '../services/auth.service.ts';
import type { CsrfTokenGenerator } from 'csrf-sync';

function emailOf(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '';
}

function limiter(prefix: string, limit: number, message: string) {
  return rateLimit({
    windowMs: env.LOGIN_RATE_WINDOW_MIN * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    passOnStoreError: false,
    skipSuccessfulRequests: true,
    store: new MariaDbRateLimitStore(prefix),
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '0.0.0.0')}|${emailOf(req)}`,
    handler: (_req, _res, next) => next(new AppError('RATE_LIMITED', message)),
  });
}

export function authRouter(generateToken: CsrfTokenGenerator) {
  const router = Router();
  const window = `${env.LOGIN_RATE_WINDOW_MIN} minutes`;
  const loginLimiter = limiter(
    'login',
    env.LOGIN_RATE_LIMIT,
    `Too many sign-in attempts for this account. Wait ${window}, or reset your password.`,
  );
  const resetLimiter = limiter(
    'reset',
    5,
    `Too many reset requests for this address. Wait ${window} and try again.`,
  );

  router.get('/csrf', publicRoute, (req, res) => {
    res.json({ csrfToken: generateToken(req, false) });
  });

  router.post('/login', publicRoute, loginLimiter, async (req, res) => {
    const input = loginInputSchema.parse(req.body);
    const user = await authenticate(input.email, input.password);
    // passport regenerates the session id here, so a fixed session id cannot be carried over.
    await new Promise<void>((resolve, reject) =>
      req.login(user, (err) => (err ? reject(err as Error) : resolve())),
    );
    res.json({ user });
  });

  router.post('/logout', publicRoute, async (req, res) => {
    await new Promise<void>((resolve, reject) =>
      req.logout((err) => (err ? reject(err as Error) : resolve())),
    );
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('sf.sid', { path: '/' });
    res.status(204).end();
  });

  // Ends every session of the caller: other phones and browsers, and this one.
  router.post('/sign-out-everywhere', requireAuth, async (req, res) => {
    const ended = await signOutEverywhere(req.user!.id);
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('sf.sid', { path: '/' });
    res.json({ ended });
  });

  router.get('/me', requireAuth, (req, res) => {
    res.json({ user: req.user });
  });

  router.post('/reset-request', publicRoute, resetLimiter, async (req, res) => {
    const input = resetRequestInputSchema.parse(req.body);
    await requestPasswordReset(input.email);
    res.status(202).json({
      message:
        'If an account uses that address, a reset link is on its way. The link works once, for 1 hour.',
    });
  });

  router.post('/reset', publicRoute, async (req, res) => {
    const input = resetInputSchema.parse(req.body);
    await resetPassword(input);
    res.json({ message: 'Your password is set. Sign in with it now.' });
  });

  return router;
}
