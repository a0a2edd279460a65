import { expect, test, type Browser, type Page } from '@playwright/test';
import { DEMO_PASSWORD, demoUsers, screenshotPath, signIn, uniqueSuffix, viewports } from './helpers.ts';

// Issue 5: a ticket's way from the dispatcher's form to the supervisor's sign-off queue, each role
// on the device it works on.

/**
 * A time zone in which it is about 06:00 now, so a P1 ticket (due in 4 h) is due "today" on the
 * technician's phone whatever the hour the suite runs at. (Etc/GMT-N is UTC+N.)
 */
function zoneWhereItIsMorning(now = new Date()): string {
  let offset = 6 - now.getUTCHours();
  if (offset < -12) offset += 24;
  return offset === 0 ? 'Etc/GMT' : `Etc/GMT${offset > 0 ? '-' : '+'}${Math.abs(offset)}`;
}

async function newPage(
  browser: Browser,
  baseURL: string | undefined,
  options: { viewport: { width: number; height: number }; timezoneId?: string },
): Promise<Page> {
  const context = await browser.newContext({ baseURL, serviceWorkers: 'block', ...options });
  return context.newPage();
}

test('dispatcher opens and dispatches a two-string ticket; technician starts and submits it; supervisor finds it awaiting sign-off', async ({
  browser,
  baseURL,
}) => {
  const title = `E2E ${uniqueSuffix()}: two strings low after hail`;
  const strings = ['INV06-MPPT3-S1', 'INV06-MPPT3-S2'];

  // ---- Dispatcher, desktop: the form, then the dispatch on the ticket page.
  const dispatcher = await newPage(browser, baseURL, { viewport: viewports.desktop });
  await signIn(dispatcher, demoUsers.dispatcher);
  await dispatcher
    .getByRole('navigation', { name: 'Main' })
    .filter({ visible: true })
    .getByRole('link', { name: 'Work orders' })
    .click();
  await dispatcher.getByRole('link', { name: 'New ticket' }).click();
  await expect(dispatcher.getByRole('heading', { level: 1, name: 'New work order' })).toBeVisible();

  await dispatcher.getByLabel('Site', { exact: true }).selectOption({ label: 'OSR · Ostrander Ridge Solar' });
  await dispatcher.getByRole('searchbox', { name: 'Search strings by label' }).fill('INV06-MPPT3');
  const picker = dispatcher.getByRole('list', { name: 'Faulty strings' });
  for (const label of strings)
    await picker.getByRole('checkbox', { name: new RegExp(`^${label}\\b`) }).check();
  await expect(dispatcher.getByRole('heading', { name: '2 strings picked' })).toBeVisible();
  await dispatcher.getByLabel(`Symptom on ${strings[0]}`).fill('Voc 40 V below the neighbours');
  await expect(dispatcher.getByRole('radio', { name: /One ticket for all 2 strings/ })).toBeChecked();

  await dispatcher.getByLabel('Title').fill(title);
  await dispatcher.getByLabel('Fault category').selectOption({ label: 'Low voltage' });
  await dispatcher.getByLabel('Reported through').selectOption({ label: 'Inspection' });
  await dispatcher.getByLabel('Priority').selectOption('P1');
  await expect(dispatcher.getByText(/At OSR a P1 is due within 4 h/)).toBeVisible();
  await dispatcher.getByRole('button', { name: 'Open ticket' }).click();

  await expect(dispatcher).toHaveURL(/\/work-orders\/\d+$/);
  await expect(dispatcher.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const ticketPath = new URL(dispatcher.url()).pathname;
  const ticketStrings = dispatcher.getByRole('region', { name: 'Strings (2)' });
  for (const label of strings)
    await expect(ticketStrings.getByRole('link', { name: label, exact: true })).toBeVisible();
  await expect(ticketStrings).toContainText('Voc 40 V below the neighbours');
  await expect(dispatcher.getByText('Reported', { exact: true }).first()).toBeVisible();
  await expect(dispatcher.getByText('Not assigned yet')).toBeVisible();
  const number = (await dispatcher.getByText(/^WO-[\w-]+ · OSR$/).innerText()).split(' · ')[0]!;

  await dispatcher.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Dispatch…' }).click();
  const dialog = dispatcher.getByRole('dialog', { name: `Dispatch: ${number}` });
  await dialog.getByRole('radio', { name: /^Demo Technician\b/ }).check();
  await dialog.getByRole('button', { name: 'Dispatch', exact: true }).click();
  await expect(dialog).toBeHidden();
  await expect(dispatcher.getByText(`${number} assigned to Demo Technician`)).toBeVisible();
  await expect(dispatcher.getByText('Dispatched', { exact: true }).first()).toBeVisible();

  // The board shows it dispatched to him.
  await dispatcher.getByRole('link', { name: 'Work orders', exact: true }).first().click();
  await dispatcher.getByRole('searchbox', { name: 'Search' }).fill(title);
  const dispatcherRow = dispatcher
    .getByRole('table', { name: 'Work orders' })
    .getByRole('row')
    .filter({ has: dispatcher.getByRole('link', { name: title }) });
  await expect(dispatcherRow).toHaveCount(1);
  await expect(dispatcherRow).toContainText('Dispatched');
  await expect(dispatcherRow).toContainText('Demo Technician');
  await expect(dispatcherRow).toContainText(`${strings[0]}${strings[1]}`);
  await dispatcher.screenshot({ path: screenshotPath('work-orders-board-dispatched-1280'), fullPage: true });
  await dispatcher.context().close();

  // ---- Technician, phone: My work (Today), then start and submit on the ticket page.
  const tech = await newPage(browser, baseURL, {
    viewport: viewports.phone,
    timezoneId: zoneWhereItIsMorning(),
  });
  await signIn(tech, demoUsers.technician);
  await expect(tech.getByRole('heading', { level: 1, name: 'My work' })).toBeVisible();
  const dueToday = tech.getByRole('region', { name: /^Due today, \d+$/ });
  const card = dueToday.getByRole('link').filter({ hasText: title });
  await expect(card).toBeVisible();
  await expect(card).toContainText(number);
  await expect(card).toContainText('Ostrander Ridge Solar');
  await expect(card).toContainText('Dispatched');
  await expect(card).toContainText(strings.join(', '));
  await card.scrollIntoViewIfNeeded();
  await tech.screenshot({ path: screenshotPath('work-orders-my-work-360'), fullPage: true });

  await card.click();
  await expect(tech).toHaveURL(new RegExp(`${ticketPath}$`));
  await expect(tech.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await tech.getByRole('button', { name: 'Start work' }).click();
  await expect(tech.getByText(`Work started on ${number}`)).toBeVisible();
  await expect(tech.getByText('In the field', { exact: true }).first()).toBeVisible();
  // In the field, the technician's way to the checks appears.
  await expect(tech.getByRole('link', { name: 'Field checks' })).toBeVisible();

  await tech.getByRole('button', { name: 'Submit for sign-off' }).click();
  await expect(tech.getByText(`${number} submitted for sign-off`)).toBeVisible();
  await expect(tech.getByText('Awaiting sign-off', { exact: true }).first()).toBeVisible();
  await expect(
    tech.getByText('Demo Technician moved it from In the field to Awaiting sign-off'),
  ).toBeVisible();
  await expect(tech.getByRole('button', { name: 'Submit for sign-off' })).toHaveCount(0);
  await tech.screenshot({ path: screenshotPath('work-orders-ticket-technician-360'), fullPage: true });
  await tech.context().close();

  // ---- Supervisor, desktop: the "Awaiting sign-off" view of the board holds it.
  const supervisor = await newPage(browser, baseURL, { viewport: viewports.desktop });
  await signIn(supervisor, demoUsers.supervisor);
  await supervisor
    .getByRole('navigation', { name: 'Main' })
    .filter({ visible: true })
    .getByRole('link', { name: 'Work orders' })
    .click();
  await supervisor
    .getByRole('navigation', { name: 'Ready-made views' })
    .getByRole('link', { name: 'Awaiting sign-off' })
    .click();
  await expect(supervisor).toHaveURL(/status=awaiting_signoff/);
  await expect(
    supervisor
      .getByRole('navigation', { name: 'Ready-made views' })
      .getByRole('link', { name: 'Awaiting sign-off' }),
  ).toHaveAttribute('aria-current', 'page');
  const board = supervisor.getByRole('table', { name: 'Work orders' });
  const row = board.getByRole('row').filter({ has: supervisor.getByRole('link', { name: title }) });
  await expect(row).toHaveCount(1);
  await expect(row).toContainText('Awaiting sign-off');
  await expect(row).toContainText('Demo Technician');
  // Every ticket in this view awaits sign-off.
  const statuses = await board
    .getByRole('row')
    .filter({ has: supervisor.getByRole('cell') })
    .allInnerTexts();
  expect(statuses.length).toBeGreaterThan(0);
  for (const text of statuses) expect(text).toContain('Awaiting sign-off');
  await supervisor.screenshot({
    path: screenshotPath('work-orders-board-awaiting-signoff-1280'),
    fullPage: true,
  });

  await row.getByRole('link', { name: title }).click();
  await expect(supervisor).toHaveURL(new RegExp(`${ticketPath}$`));
  await expect(supervisor.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await expect(supervisor.getByText('Awaiting sign-off', { exact: true }).first()).toBeVisible();
  await expect(supervisor.getByRole('link', { name: 'Review and sign off' })).toBeVisible();
  await expect(supervisor.getByRole('button', { name: 'Return to technician…' })).toBeVisible();
  await supervisor.screenshot({ path: screenshotPath('work-orders-ticket-supervisor-1280'), fullPage: true });
  await supervisor.context().close();
});

test('focus stays on the same row when the board switches between table and cards at 768 px', async ({
  browser,
  baseURL,
}) => {
  const dispatcher = await newPage(browser, baseURL, { viewport: viewports.desktop });
  await signIn(dispatcher, demoUsers.dispatcher, undefined, '/work-orders');
  const table = dispatcher.getByRole('table', { name: 'Work orders' });
  const cards = dispatcher.getByRole('list', { name: 'Work orders' });
  await expect(table.getByRole('row').nth(3)).toBeVisible();

  /** The focused element: whether it is inside the board, its row's id, and what it is. */
  const focused = () =>
    dispatcher.evaluate(() => {
      const el = document.activeElement;
      const board = document.querySelector('table, ul[aria-label="Work orders"]');
      return {
        isInBoard: Boolean(el && board?.contains(el)),
        rowId: el?.closest('[data-row-id]')?.getAttribute('data-row-id') ?? null,
        href: el?.getAttribute('href') ?? null,
        type: el?.getAttribute('type') ?? null,
        tag: el?.tagName ?? null,
      };
    });

  // A row's ticket link, by keyboard as a person would reach it.
  const link = table.getByRole('row').nth(3).getByRole('link');
  await link.focus();
  const before = await focused();
  expect(before.isInBoard).toBe(true);
  expect(before.href).toMatch(/^\/work-orders\/\d+$/);

  await dispatcher.setViewportSize({ width: 700, height: 900 });
  await expect(cards).toBeVisible();
  await expect(table).toHaveCount(0);
  expect(await focused(), 'the same ticket link in the card layout').toEqual(before);

  await dispatcher.setViewportSize(viewports.desktop);
  await expect(table).toBeVisible();
  expect(await focused(), 'the same ticket link back in the table').toEqual(before);

  // Another control of another row: the row's selection checkbox.
  const checkbox = table.getByRole('row').nth(5).getByRole('checkbox');
  await checkbox.focus();
  const checkboxBefore = await focused();
  expect(checkboxBefore).toMatchObject({ isInBoard: true, type: 'checkbox' });
  await dispatcher.setViewportSize({ width: 700, height: 900 });
  await expect(cards).toBeVisible();
  expect(await focused(), 'the same checkbox in the card layout').toEqual(checkboxBefore);

  // A control with no twin (a column's sort button exists in the table only): the board keeps focus.
  await dispatcher.setViewportSize(viewports.desktop);
  await table.getByRole('button', { name: /^Deadline/ }).focus();
  await dispatcher.setViewportSize({ width: 700, height: 900 });
  await expect(cards).toBeVisible();
  expect(
    await dispatcher.evaluate(() => {
      const el = document.activeElement;
      return Boolean(
        el && el !== document.body && el.contains(document.querySelector('ul[aria-label="Work orders"]')),
      );
    }),
    'focus on the board’s container',
  ).toBe(true);
  await dispatcher.context().close();
});

test('the board table fits a 1280 px screen beside the navigation, open tickets and closed ones', async ({ browser, baseURL }) => {
  const page = await newPage(browser, baseURL, { viewport: viewports.desktop });
  await signIn(page, demoUsers.dispatcher);
  for (const search of ['', '?status=all']) {
    await page.goto(`/work-orders${search}`);
    const table = page.getByRole('table');
    await expect(table.getByRole('row').nth(1)).toBeVisible();
    // Its scrolling box: no column (the deadline last of all) may sit beyond the right edge.
    const box = await table.evaluate((t) => ({ scroll: t.parentElement!.scrollWidth, client: t.parentElement!.clientWidth }));
    expect(box.scroll, `/work-orders${search}`).toBeLessThanOrEqual(box.client);
  }
  await page.context().close();
});

/**
 * A first visit of the board on a phone (signed in through the API, nothing of the person kept on the
 * device yet) whose ticket list answers after `delayMs`; counts the placeholders the list draws.
 */
async function firstVisitOfBoard(browser: Browser, baseURL: string | undefined, delayMs: number) {
  const page = await newPage(browser, baseURL, { viewport: viewports.phone });
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const res = await page.request.post('/api/auth/login', {
    data: { email: demoUsers.dispatcher, password: DEMO_PASSWORD },
    headers: { 'x-csrf-token': csrfToken },
  });
  expect(res.ok()).toBe(true);
  await page.addInitScript(() => {
    const drawn = { count: 0 };
    (window as unknown as { __skeletons: typeof drawn }).__skeletons = drawn;
    // Only the list's own rows: the start-up frame has placeholders of its own.
    const isListRow = (el: Element) => el.closest('[role="status"]')?.textContent?.startsWith('Loading work orders') === true;
    new MutationObserver((records) => {
      for (const r of records)
        for (const node of r.addedNodes)
          if (node instanceof Element)
            drawn.count += [...(node.matches('.animate-shimmer') ? [node] : []), ...node.querySelectorAll('.animate-shimmer')].filter(isListRow).length;
    }).observe(document, { subtree: true, childList: true });
  });
  await page.route(/\/api\/work-orders\?/, async (route) => {
    await new Promise((resolve) => setTimeout(resolve, delayMs));
    await route.continue();
  });
  await page.goto('/work-orders');
  return {
    page,
    cards: page.getByRole('list', { name: 'Work orders' }).getByRole('listitem'),
    skeletonsDrawn: () => page.evaluate(() => (window as unknown as { __skeletons: { count: number } }).__skeletons.count),
  };
}

test('a slow board shows its loading rows after a moment, a quick one goes straight to the tickets', async ({ browser, baseURL }) => {
  // Slow: the list says at once that it is loading, and draws its placeholder rows after a moment.
  const slow = await firstVisitOfBoard(browser, baseURL, 2_500);
  await expect(slow.page.getByRole('status').filter({ hasText: 'Loading work orders' })).toBeAttached();
  await expect(slow.page.locator('main .animate-shimmer').filter({ visible: true }).first()).toBeVisible();
  await slow.page.screenshot({ path: screenshotPath('work-orders-board-loading-360') });
  await expect(slow.cards.first()).toBeVisible();
  expect(await slow.skeletonsDrawn()).toBeGreaterThan(0);
  await slow.page.context().close();

  // Quick (the answer after 50 ms): straight to the tickets, no placeholder drawn and taken away again.
  const quick = await firstVisitOfBoard(browser, baseURL, 50);
  await expect(quick.cards.first()).toBeVisible();
  expect(await quick.skeletonsDrawn()).toBe(0);
  await quick.page.context().close();
});
