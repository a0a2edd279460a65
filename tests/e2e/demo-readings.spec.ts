import { expect, test } from '@playwright/test';
import { apiSignIn, demoUsers, screenshotPath, signIn, siteIdByCode, viewports } from './helpers.ts';

// The demo plant comes with readings: the fleet map of Fenwick Moor is a mix of checked and unchecked
// strings, and the diode ticket waiting for sign-off carries its before and after checks and its
// replacement record. Screenshots go to tests/e2e/screenshots/demo-*.png for a person to look at.

test.use({ serviceWorkers: 'block' });

type HealthMap = { counts: { pass: number; attention: number; fail: number; unchecked: number } };

test('the Fenwick Moor health map shows the demo readings (desktop and phone)', async ({ page, baseURL }) => {
  const api = await apiSignIn(demoUsers.dispatcher, { baseURL });
  const siteId = await siteIdByCode(api, 'FWM');
  const { counts } = await api.get<HealthMap>(`/api/fleet/sites/${siteId}/health-map`);
  await api.dispose();
  expect(counts.pass).toBeGreaterThan(50);
  expect(counts.attention).toBeGreaterThan(0);
  expect(counts.unchecked).toBeLessThan(600);

  for (const viewport of [viewports.desktop, viewports.phone]) {
    await page.setViewportSize(viewport);
    if (viewport === viewports.desktop) await signIn(page, demoUsers.dispatcher, undefined, `/fleet/sites/${siteId}`);
    else await page.goto(`/fleet/sites/${siteId}`);
    const map = page.getByRole('grid', { name: /String health map of Fenwick Moor Solar/ });
    await expect(map).toBeVisible();
    await expect(map.getByRole('gridcell', { name: /^INV11-MPPT1-S1: Pass/ })).toHaveCount(1);
    await page.screenshot({ path: screenshotPath(`demo-fleet-map-${viewport.width}`), fullPage: viewport === viewports.desktop });
  }
});

test('the supervisor sees the diode ticket with its checks and replacement record', async ({ page, baseURL }) => {
  const api = await apiSignIn(demoUsers.supervisor, { baseURL });
  const list = await api.get<{ items: Array<{ id: number; title: string }> }>(`/api/work-orders?q=${encodeURIComponent('One substring short')}`);
  await api.dispose();
  const ticket = list.items.find((t) => t.title.startsWith('One substring short'))!;
  await page.setViewportSize(viewports.desktop);
  await signIn(page, demoUsers.supervisor, undefined, `/work-orders/${ticket.id}`);
  const checklist = page.getByRole('region', { name: 'Sign-off' }).getByRole('list', { name: 'Sign-off checklist' });
  await expect(checklist).toBeVisible();
  await expect(checklist).toContainText('Every string has an after-repair check that passes');
  await checklist.scrollIntoViewIfNeeded();
  await page.screenshot({ path: screenshotPath('demo-diode-sign-off-1280'), fullPage: true });
});
