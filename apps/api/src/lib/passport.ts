import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { findActiveSessionUser } from '../services/auth.service.ts';

passport.serializeUser<number>((user, done) => done(null, user.id));

// A deactivated or deleted account resolves to "signed out" on its very next request.
passport.deserializeUser<number>((id, done) => {
  findActiveSessionUser(id).then(
    (user) => done(null, user ?? false),
    (err: unknown) => done(err),
  );
});

// The strategy is registered for completeness; the login route calls the service directly so that it can
// answer each failure (unknown account, wrong password, deactivated) with its own message.
passport.use(new LocalStrategy({ usernameField: 'email' }, (_email, _password, done) => done(null, false)));

export { passport };
