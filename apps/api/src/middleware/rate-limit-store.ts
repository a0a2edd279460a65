import { QueryTypes } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { sequelize } from '../lib/db.ts';

/** express-rate-limit counters in MariaDB, so that every API process counts against one limit. */
export class MariaDbRateLimitStore implements Store {
  windowMs = 15 * 60 * 1000;
  localKeys = false;
  constructor(readonly prefix: string) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string) {
    return `${this.prefix}:${key}`.slice(0, 255);
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const rows = await sequelize.query<{ hits: number; reset_at: Date }>(
      'SELECT hits, reset_at FROM rate_limit_hits WHERE `key` = ? AND reset_at > ?',
      { replacements: [this.key(key), new Date()], type: QueryTypes.SELECT },
    );
    const row = rows[0];
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = new Date();
    const resetAt = new Date(now.getTime() + this.windowMs);
    await sequelize.query(
      'INSERT INTO rate_limit_hits (`key`, hits, reset_at) VALUES (?, 1, ?) ' +
        'ON DUPLICATE KEY UPDATE hits = IF(reset_at <= ?, 1, hits + 1), reset_at = IF(reset_at <= ?, VALUES(reset_at), reset_at)',
      { replacements: [this.key(key), resetAt, now, now] },
    );
    return (await this.get(key)) ?? { totalHits: 1, resetTime: resetAt };
  }

  async decrement(key: string): Promise<void> {
    await sequelize.query('UPDATE rate_limit_hits SET hits = GREATEST(hits - 1, 0) WHERE `key` = ?', {
      replacements: [this.key(key)],
    });
  }

  async resetKey(key: string): Promise<void> {
    await sequelize.query('DELETE FROM rate_limit_hits WHERE `key` = ?', { replacements: [this.key(key)] });
  }
}
