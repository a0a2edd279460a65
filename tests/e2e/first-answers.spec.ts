import { expect, test, type Page } from '@playwright/test';
import { apiSignIn, DEMO_PASSWORD, demoUsers, openDispatchedTicket, signIn, uniqueSuffix, viewports } from './helpers.ts';

// The board and the field page ask for their data as soon as their code and the signed-in person are
// known (apps/web/src/app/first-page.ts, lib/early-answers.ts), not once React has drawn the page and
// its queries mount; and the queries take those answers over instead of asking a second time.

test.use({ viewport: viewports.phone, serviceWorkers: 'block' });

type Call = { path: string; isPageDrawn: boolean };

/** Every API call the page makes from its first script on, and whether the page's heading was drawn by then. */
async function recordCalls(page: Page) {
  await page.addInitScript(() => {
    const calls: Array<{ path: string; isPageDrawn: boolean }> = [];
    (window as unknown as { __calls: typeof calls }).__calls = calls;
    const original = window.fetch.bind(window);
    window.fetch = (input, init) => {
      const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, location.href);
      if (url.pathname.startsWith('/api/')) {
        calls.push({ path: url.pathname + url.search, isPageDrawn: document.querySelector('main h1') !== null });
      }
      return original(input, init);
    };
  });
}

/**
 * Signs the browser in without opening the app, so that no copy of the person is kept on the device yet
 * and the page waits for the server to say who is signed in (the first visit of the day).
 */
async function signInFirstVisit(page: Page, email: string) {
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const res = await page.request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD }, headers: { 'x-csrf-token': csrfToken } });
  expect(res.ok()).toBe(true);
}

const callsOf = (page: Page) => page.evaluate(() => (window as unknown as { __calls: Call[] }).__calls);

test('the board asks for its tickets, sites and technicians before it is drawn, and once each', async ({ page }) => {
  await signInFirstVisit(page, demoUsers.dispatcher);
  await recordCalls(page);
  await page.goto('/work-orders');
  await expect(page.getByRole('heading', { level: 1, name: 'Work orders' })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Work orders' }).getByRole('listitem').first()).toBeVisible();
  await page.waitForLoadState('networkidle');

  const calls = await callsOf(page);
  const board = calls.filter((c) => c.path.startsWith('/api/work-orders?'));
  const sites = calls.filter((c) => c.path.startsWith('/api/sites?'));
  const technicians = calls.filter((c) => c.path === '/api/technicians');
  expect(board, JSON.stringify(calls)).toHaveLength(1);
  expect(sites, JSON.stringify(calls)).toHaveLength(1);
  expect(technicians, JSON.stringify(calls)).toHaveLength(1);
  expect([...board, ...sites, ...technicians].every((c) => !c.isPageDrawn), JSON.stringify(calls)).toBe(true);
});

test('the field page asks for the ticket and its checks before it is drawn, and each string once', async ({ page, baseURL }) => {
  const dispatcher = await apiSignIn(demoUsers.dispatcher, { baseURL });
  const technician = await apiSignIn(demoUsers.technician, { baseURL });
  try {
    const labels = ['INV07-MPPT2-S1', 'INV07-MPPT2-S2'];
    const ticket = await openDispatchedTicket(dispatcher, { siteCode: 'OSR', labels, title: `E2E ${uniqueSuffix()}: early answers` });
    await technician.post(`/api/work-orders/${ticket.id}/transitions`, { to: 'in_field', version: ticket.version });

    await signInFirstVisit(page, demoUsers.technician);
    await recordCalls(page);
    await page.goto(`/work-orders/${ticket.id}/field`);
    await expect(page.getByRole('heading', { level: 1, name: 'Field checks' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Before you measure: DC is live in daylight' })).toBeVisible();
    await page.waitForLoadState('networkidle');

    const calls = await callsOf(page);
    const detail = calls.filter((c) => c.path === `/api/work-orders/${ticket.id}`);
    const checks = calls.filter((c) => c.path.startsWith(`/api/work-orders/${ticket.id}/checks`));
    const strings = calls.filter((c) => c.path.startsWith('/api/strings/'));
    expect(detail, JSON.stringify(calls)).toHaveLength(1);
    expect(checks, JSON.stringify(calls)).toHaveLength(1);
    expect([...detail, ...checks].every((c) => !c.isPageDrawn), JSON.stringify(calls)).toBe(true);
    expect(strings.map((c) => c.path).sort(), JSON.stringify(calls)).toEqual([...new Set(strings.map((c) => c.path))].sort());
    expect(strings, JSON.stringify(calls)).toHaveLength(labels.length);
  } finally {
    await dispatcher.dispose();
    await technician.dispose();
  }
});

test("a technician's Today page asks for their work list before it is drawn, and once", async ({ page }) => {
  await signInFirstVisit(page, demoUsers.technician);
  await recordCalls(page);
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.waitForLoadState('networkidle');

  const calls = await callsOf(page);
  const mine = calls.filter((c) => c.path.startsWith('/api/work-orders?') && c.path.includes('assigneeId=me'));
  expect(mine, JSON.stringify(calls)).toHaveLength(1);
  expect(mine[0]?.isPageDrawn, JSON.stringify(calls)).toBe(false);
});

test('a board drawn from the kept copy before the server has said who is signed in asks for each answer once', async ({ page }) => {
  await signIn(page, demoUsers.dispatcher);
  await page.goto('/work-orders');
  await expect(page.getByRole('list', { name: 'Work orders' }).getByRole('listitem').first()).toBeVisible();
  // The person is kept on the device: on the next load the page is drawn from that copy, and asks for its
  // data, while the server's answer to "who is signed in" is still on its way (held here).
  await page.route('**/api/auth/me', async (route) => {
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    await route.continue();
  });
  await recordCalls(page);
  await page.reload();
  await expect(page.getByRole('list', { name: 'Work orders' }).getByRole('listitem').first()).toBeVisible();
  await expect.poll(async () => (await callsOf(page)).some((c) => c.path === '/api/auth/me')).toBe(true);
  await page.waitForTimeout(2_000);
  await page.waitForLoadState('networkidle');

  const calls = await callsOf(page);
  for (const prefix of ['/api/work-orders?', '/api/sites?', '/api/technicians']) {
    expect(calls.filter((c) => c.path.startsWith(prefix)), `${prefix} ${JSON.stringify(calls)}`).toHaveLength(1);
  }
});

