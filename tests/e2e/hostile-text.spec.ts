import { expect, test } from '@playwright/test';
import {
  apiSignIn,
  demoUsers,
  screenshotPath,
  signIn,
  siteIdByCode,
  stringIdsByLabel,
  uniqueSuffix,
  viewports,
  type ApiSession,
} from './helpers.ts';

// Text people type — a ticket's title, description and string symptom, a comment — is shown as text:
// markup in it is never parsed and nothing in it runs. React escapes what it renders and the CSP would
// block inline script anyway; this checks the first line of defence, on the page as the browser builds it.

test.use({ viewport: viewports.desktop, serviceWorkers: 'block' });

let dispatcher: ApiSession;

test.beforeAll(async ({ baseURL }) => {
  dispatcher = await apiSignIn(demoUsers.dispatcher, { baseURL });
});
test.afterAll(async () => {
  await dispatcher?.dispose();
});

test('markup in a title, a description, a symptom and a comment shows as text and runs nothing', async ({ page }) => {
  const suffix = uniqueSuffix();
  const title = `<img src=x onerror="window.__sfXss=1"> E2E ${suffix}`;
  const description = `<script>window.__sfXss=2</script> "quotes" & 'apostrophes' {{constructor.constructor('window.__sfXss=3')()}}`;
  const symptom = `<iframe src="javascript:window.__sfXss=5"></iframe>`;
  const comment = `<svg onload="window.__sfXss=4"></svg> ' OR 1=1 -- ${suffix}`;
  const siteId = await siteIdByCode(dispatcher, 'FWM');
  const [stringId] = await stringIdsByLabel(dispatcher, siteId, ['INV25-MPPT6-S4']);
  const { items } = await dispatcher.post<{ items: Array<{ id: number }> }>('/api/work-orders', {
    siteId,
    strings: [{ stringId, symptom }],
    mode: 'single',
    faultCategory: 'other',
    priority: 'P4',
    title,
    description,
    source: 'other',
  });
  const ticketId = items[0]!.id;
  await dispatcher.post(`/api/work-orders/${ticketId}/comments`, { body: comment });

  const dialogs: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  await signIn(page, demoUsers.dispatcher, undefined, `/work-orders?q=${suffix}`);
  const link = page.getByRole('link', { name: title });
  await expect(link).toBeVisible();
  await link.click();
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await expect(page.getByText(description, { exact: true })).toBeVisible();
  await expect(page.getByText(symptom, { exact: true })).toBeVisible();
  await expect(page.getByText(comment, { exact: true })).toBeVisible();
  await page.screenshot({ path: screenshotPath('hostile-text-ticket'), fullPage: true });

  expect(await page.locator('img[src="x"], svg[onload], iframe, main script').count()).toBe(0);
  expect(await page.evaluate(() => (window as unknown as { __sfXss?: number }).__sfXss)).toBeUndefined();
  expect(dialogs).toEqual([]);
});
