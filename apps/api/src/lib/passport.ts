import type { Request } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { findActiveSessionUser } from '../services/auth.service.ts';
import { takePreloadedUser } from './session-store.ts';

passport.serializeUser<number>((user, done) => done(null, user.id));

// A deactivated or deleted account resolves to "signed out" on its very next request. The session store
// usually read the account in the same query as the session; otherwise it is looked up here.
passport.deserializeUser<number>(
  (req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    const preloaded = takePreloadedUser(req, id);
    if (preloaded !== undefined) {
      done(null, preloaded.isActive ? preloaded.sessionUser : false);
      return;
    }
    findActiveSessionUser(id).then(
      (user) => done(null, user ?? false),
      (err: unknown) => done(err),
    );
  },
);

// The strategy is registered for completeness; the login route calls the service directly so that it can
// answer each failure (unknown account, wrong password, deactivated) with its own message.
passport.use(new LocalStrategy({ usernameField: 'email' }, (_email, _password, done) => done(null, false)));

export { passport };
