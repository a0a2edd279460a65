import fs from 'node:fs/promises';
import supertest from 'supertest';
import type { Express } from 'express';
import { QueryTypes, type Transaction } from 'sequelize';
import { expect } from 'vitest';
import { createApp } from '../../apps/api/src/app.ts';
import { sequelize } from '../../apps/api/src/models/index.ts';
import { mailIdle } from '../../apps/api/src/lib/mailer.ts';
import { seedDemo } from '../../apps/api/seeders/demo.ts';
import { DEMO_PASSWORD } from '../../apps/api/seeders/demo-users.ts';
import { readCaughtMail, type CaughtMail } from '../../scripts/mail-catcher.ts';
import { apiTestEnv } from './test-env.ts';

export { DEMO_PASSWORD };

export const demoEmail = {
  admin: 'admin@stringfield.test',
  dispatcher: 'dispatcher@stringfield.test',
  technician: 'tech@stringfield.test',
  supervisor: 'supervisor@stringfield.test',
  owner: 'owner@stringfield.test',
  otherOwner: 'calder.owner@stringfield.test',
} as const;

let shared: Express | undefined;
/** One app instance per test file (it never listens; supertest binds an ephemeral port per request). */
export function app(): Express {
  shared ??= createApp({ webDist: null });
  return shared;
}

/** Empty every table the suites write to and put the demo crew (and, when asked, the demo plant) back. */
export async function resetDatabase({ plant = false } = {}): Promise<void> {
  // A delivery still running from the previous test would write to re-used outbox ids after TRUNCATE.
  await mailIdle();
  await sequelize.query('SET FOREIGN_KEY_CHECKS = 0');
  for (const table of [
    'sign_offs',
    'diode_replacements',
    'thermal_findings',
    'photos',
    'iv_traces',
    'string_checks',
    'instruments',
    'comments',
    'work_order_events',
    'work_order_strings',
    'work_orders',
    'work_order_counters',
    'site_sla_hours',
    'sessions',
    'password_tokens',
    'mail_outbox',
    'rate_limit_hits',
    'pv_strings',
    'combiner_boxes',
    'inverters',
    'inverter_models',
    'module_models',
    'site_owners',
    'sites',
    'users',
  ]) {
    await sequelize.query(`TRUNCATE TABLE \`${table}\``);
  }
  await sequelize.query('SET FOREIGN_KEY_CHECKS = 1');
  // With the photos table empty, so is the folder of their files: each demo seed writes its photos anew.
  await fs.rm(apiTestEnv.UPLOADS_DIR, { recursive: true, force: true });
  await seedDemo({ plant });
}

export type Agent = ReturnType<typeof supertest.agent> & { csrf: string };

/** A cookie-keeping client with a CSRF token for its session. */
export async function newAgent(on: Express = app()): Promise<Agent> {
  const agent = supertest.agent(on) as Agent;
  const res = await agent.get('/api/auth/csrf').expect(200);
  agent.csrf = (res.body as { csrfToken: string }).csrfToken;
  return agent;
}

/** Refresh the agent's CSRF token (the session id, and so the token, changes at sign-in). */
export async function refreshCsrf(agent: Agent): Promise<void> {
  const res = await agent.get('/api/auth/csrf').expect(200);
  agent.csrf = (res.body as { csrfToken: string }).csrfToken;
}

export async function signIn(email: string, password = DEMO_PASSWORD, on: Express = app()): Promise<Agent> {
  const agent = await newAgent(on);
  await agent.post('/api/auth/login').set('x-csrf-token', agent.csrf).send({ email, password }).expect(200);
  await refreshCsrf(agent);
  return agent;
}

/** Wait until the mail catcher holds a message to `to` matching `subject` received at or after `since` (ms). */
export async function waitForMail(to: string, subject: RegExp, since = 0, timeoutMs = 10_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const all = await readCaughtMail(apiTestEnv.MAIL_CATCHER_DIR);
    const hit = all
      .reverse()
      .find((m) => m.to.includes(to) && subject.test(m.subject) && Date.parse(m.receivedAt) >= since);
    if (hit) return hit;
    if (Date.now() > deadline) throw new Error(`No mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function tokenFromLink(text: string): string {
  const match = /token=([A-Za-z0-9_-]+)/.exec(text);
  expect(match, 'mail carries a link with a token').not.toBeNull();
  return match![1]!;
}

export function errorOf(res: { body: unknown }) {
  return (res.body as { error: { code: string; message: string; fields?: Record<string, string> } }).error;
}

/**
 * Resolves once another connection of this database has been running a statement matching `statement` for
 * over 100 ms: a request stuck behind a lock (a passing query, such as mail delivery's, is gone by then).
 */
export async function someoneWaits(transaction: Transaction, statement: RegExp): Promise<void> {
  const deadline = Date.now() + 10_000;
  let seen = new Map<number, string>();
  while (Date.now() < deadline) {
    const rows = await sequelize.query<{ id: number; info: string | null }>(
      "SELECT ID AS id, INFO AS info FROM information_schema.PROCESSLIST WHERE DB = DATABASE() AND COMMAND = 'Query' AND ID <> CONNECTION_ID()",
      { type: QueryTypes.SELECT, transaction },
    );
    const now = new Map(rows.filter((r) => r.info && statement.test(r.info)).map((r) => [Number(r.id), r.info!]));
    if ([...now].some(([id, info]) => seen.get(id) === info)) return;
    seen = now;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no request waited on the database with a statement like ${statement}`);
}
