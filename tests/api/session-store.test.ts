import { beforeEach, describe, expect, it } from 'vitest';
import { Session, User, sequelize } from '../../apps/api/src/models/index.ts';
import { SESSION_TOUCH_INTERVAL_MS } from '../../apps/api/src/lib/session-store.ts';
import { demoEmail, resetDatabase, signIn, type Agent } from './helpers.ts';

beforeEach(resetDatabase);

const HOUR_MS = 3_600_000;

async function sessionOf(agent: Agent, email: string) {
  await agent.get('/api/auth/me').expect(200);
  const user = (await User.findOne({ where: { email } }))!;
  const rows = await Session.findAll({ where: { userId: user.id } });
  expect(rows).toHaveLength(1);
  return rows[0]!;
}

/** The SQL statements a block of work sends, in order. */
async function statementsDuring(work: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  // After the query: Sequelize fills in the statement when it runs it.
  sequelize.addHook('afterQuery', 'count-statements', (_options, query) => {
    seen.push((query as unknown as { sql?: string }).sql ?? '');
  });
  try {
    await work();
  } finally {
    sequelize.removeHook('afterQuery', 'count-statements');
  }
  return seen;
}

describe('the MariaDB session store', () => {
  it('reads the session and its account in one statement and writes nothing on a plain signed-in request', async () => {
    const agent = await signIn(demoEmail.dispatcher);
    await agent.get('/api/auth/me').expect(200);
    const sql = await statementsDuring(() => agent.get('/api/auth/me').expect(200));
    expect(sql).toHaveLength(1);
    expect(sql[0]).toMatch(/FROM sessions s LEFT JOIN users u/);
  });

  it('signs out a session whose expiry has passed, even before the expiry sweep deletes the row', async () => {
    const agent = await signIn(demoEmail.technician);
    const row = await sessionOf(agent, demoEmail.technician);
    await Session.update({ expires: new Date(Date.now() - 1000) }, { where: { sid: row.sid } });
    await agent.get('/api/auth/me').expect(401);
  });

  it(`slides the expiry only when it would move by more than ${SESSION_TOUCH_INTERVAL_MS / 60_000} minutes`, async () => {
    const agent = await signIn(demoEmail.technician);
    const fresh = await sessionOf(agent, demoEmail.technician);
    const firstExpiry = fresh.expires!.getTime();
    expect(firstExpiry).toBeGreaterThan(Date.now() + 11 * HOUR_MS);

    // A minute later: not worth a write.
    await Session.update({ expires: new Date(firstExpiry - 60_000) }, { where: { sid: fresh.sid } });
    await agent.get('/api/auth/me').expect(200);
    expect((await Session.findByPk(fresh.sid))!.expires!.getTime()).toBe(firstExpiry - 60_000);

    // Ten minutes later: the expiry moves to 12 hours from now.
    await Session.update(
      { expires: new Date(Date.now() + 12 * HOUR_MS - 10 * 60_000) },
      { where: { sid: fresh.sid } },
    );
    const before = Date.now();
    await agent.get('/api/auth/me').expect(200);
    const slid = (await Session.findByPk(fresh.sid))!.expires!.getTime();
    expect(slid).toBeGreaterThanOrEqual(before + 12 * HOUR_MS - 2000);
  });

  it('still signs a deactivated account out on its next request', async () => {
    const agent = await signIn(demoEmail.technician);
    await agent.get('/api/auth/me').expect(200);
    await User.update({ isActive: false }, { where: { email: demoEmail.technician } });
    await agent.get('/api/auth/me').expect(401);
  });
});
