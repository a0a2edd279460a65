import type { Request } from 'express';
import session, { type SessionData } from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import { QueryTypes } from 'sequelize';
import type { SessionUser } from '@stringfield/shared';
import { env } from '../config/env.ts';
// From the models' index, so that the Session model is registered before the store looks it up.
import { sequelize } from '../models/index.ts';

const SequelizeStore = connectSessionSequelize(session.Store);

/**
 * A signed-in session's row is written again only when its expiry would move by more than this. With a
 * 12-hour idle timeout, a session therefore ends at most 5 minutes earlier than "12 hours after the last
 * request", and a busy client costs one UPDATE per 5 minutes instead of one per request.
 */
export const SESSION_TOUCH_INTERVAL_MS = 5 * 60 * 1000;

type SessionRow = {
  data: string;
  expires: Date | null;
  user_id: number | null;
  email: string | null;
  name: string | null;
  role: SessionUser['role'] | null;
  is_active: number | boolean | null;
};

/** What `get` read beside the session data, handed to `createSession` (which sees the request). */
type Loaded = {
  expiresMs: number | null;
  user: { id: number; isActive: boolean; sessionUser: SessionUser } | null;
};
const loadedKey = Symbol('stringfield.session.loaded');
type Carrier = SessionData & { [loadedKey]?: Loaded };

// Keyed by the request / session objects, so that nothing outlives the request.
const preloadedUsers = new WeakMap<Request, Loaded['user']>();
const loadedExpiry = new WeakMap<object, number | null>();

/**
 * The account behind the session, read by the same query as the session itself, or `undefined` when the
 * store did not load it for this request (the caller then looks the user up itself).
 */
export function takePreloadedUser(
  req: Request,
  id: number,
): { isActive: boolean; sessionUser: SessionUser } | undefined {
  const user = preloadedUsers.get(req);
  preloadedUsers.delete(req);
  return user && user.id === id ? user : undefined;
}

function inflate(row: SessionRow): Carrier {
  const data = JSON.parse(row.data) as Carrier;
  const user =
    row.user_id !== null && row.email !== null && row.name !== null && row.role !== null
      ? {
          id: row.user_id,
          isActive: Boolean(row.is_active),
          sessionUser: { id: row.user_id, email: row.email, name: row.name, role: row.role },
        }
      : null;
  // A symbol key: express-session neither copies it into the session nor hashes or saves it.
  data[loadedKey] = { expiresMs: row.expires ? new Date(row.expires).getTime() : null, user };
  return data;
}

const done = (fn: ((err?: unknown) => void) | undefined, err?: unknown) => fn?.(err);

/**
 * Sessions in MariaDB (shared by every API process), as connect-session-sequelize keeps them, with the
 * per-request cost cut down:
 * - one query reads the session and its user (passport's deserializeUser then needs no second lookup);
 *   a row past its expiry counts as no session, even before the sweep deletes it;
 * - saving is one upsert, destroying one DELETE (the library reads the row first in both);
 * - touching (sliding the expiry on every request) writes only when the expiry moves by more than
 *   SESSION_TOUCH_INTERVAL_MS.
 */
export class MariaDbSessionStore extends SequelizeStore {
  constructor() {
    super({
      db: sequelize,
      table: 'Session',
      checkExpirationInterval: 15 * 60 * 1000,
      expiration: env.SESSION_MAX_AGE_HOURS * 60 * 60 * 1000,
    });
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    sequelize
      .query<SessionRow>(
        `SELECT s.data, s.expires, s.user_id, u.email, u.name, u.role, u.is_active
           FROM sessions s LEFT JOIN users u ON u.id = s.user_id
          WHERE s.sid = ? AND (s.expires IS NULL OR s.expires > ?)`,
        { replacements: [sid, new Date()], type: QueryTypes.SELECT },
      )
      .then(
        (rows) => {
          let data: Carrier | null;
          try {
            data = rows[0] ? inflate(rows[0]) : null;
          } catch (err) {
            callback(err);
            return;
          }
          // Outside the try: express-session runs the rest of the request from this callback.
          callback(null, data);
        },
        (err: unknown) => callback(err),
      );
  }

  override createSession(req: Request, data: SessionData) {
    const loaded = (data as Carrier)[loadedKey];
    delete (data as Carrier)[loadedKey];
    const created = super.createSession(req, data);
    if (loaded) {
      preloadedUsers.set(req, loaded.user);
      loadedExpiry.set(created, loaded.expiresMs);
    }
    return created;
  }

  override set(sid: string, data: SessionData, callback?: (err?: unknown) => void): void {
    const now = new Date();
    const userId = (data as SessionData & { passport?: { user?: number } }).passport?.user ?? null;
    sequelize
      .query(
        `INSERT INTO sessions (sid, user_id, expires, data, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?)
         ON DUPLICATE KEY UPDATE user_id = VALUES(user_id), expires = VALUES(expires), data = VALUES(data), updated_at = VALUES(updated_at)`,
        { replacements: [sid, userId, this.expiryOf(data), JSON.stringify(data), now, now] },
      )
      .then(
        () => done(callback),
        (err: unknown) => done(callback, err),
      );
  }

  override touch = (sid: string, data: SessionData, callback?: (err?: unknown) => void): void => {
    const expires = this.expiryOf(data);
    const stored = loadedExpiry.get(data);
    if (stored !== undefined && stored !== null && expires.getTime() - stored < SESSION_TOUCH_INTERVAL_MS) {
      done(callback);
      return;
    }
    sequelize
      .query('UPDATE sessions SET expires = ?, updated_at = ? WHERE sid = ?', {
        replacements: [expires, new Date(), sid],
      })
      .then(
        () => {
          loadedExpiry.set(data, expires.getTime());
          done(callback);
        },
        (err: unknown) => done(callback, err),
      );
  };

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    sequelize.query('DELETE FROM sessions WHERE sid = ?', { replacements: [sid] }).then(
      () => done(callback),
      (err: unknown) => done(callback, err),
    );
  }

  private expiryOf(data: SessionData): Date {
    const expires = data.cookie?.expires;
    return expires ? new Date(expires) : new Date(Date.now() + env.SESSION_MAX_AGE_HOURS * 60 * 60 * 1000);
  }
}
