import { expect, test } from '@playwright/test';
import { apiSignIn, demoUsers, screenshotPath, signIn, viewports } from './helpers.ts';

// Issue 9: the dispatcher reads the fleet — every string of a 600-string site on one map, laid out by
// inverter and MPPT input, opened from the keyboard; the metrics with their numbers as tables — on a
// desktop and on a phone. The owner sees the fleet of their own sites only.
// Screenshots go to tests/e2e/screenshots/fleet-*.png for a person to look at.

test.use({ serviceWorkers: 'block' });

type Site = { id: number; code: string; name: string };

async function siteIds(baseURL: string | undefined) {
  const admin = await apiSignIn(demoUsers.admin, { baseURL });
  const { items } = await admin.get<{ items: Site[] }>('/api/sites?pageSize=50');
  await admin.dispose();
  return Object.fromEntries(items.map((s) => [s.code, s])) as Record<string, Site>;
}

for (const [name, viewport] of Object.entries(viewports)) {
  test(`dispatcher reads the health map of a 600-string site (${name})`, async ({ page, baseURL }) => {
    const sites = await siteIds(baseURL);
    await page.setViewportSize(viewport);
    await signIn(page, demoUsers.dispatcher, undefined, `/fleet/sites/${sites.FWM!.id}`);

    const map = page.getByRole('grid', { name: /String health map of Fenwick Moor Solar/ });
    await expect(map).toBeVisible();
    // Every string is a cell with a name of its own (label, verdict, deviation, tickets), not colour alone.
    await expect(map.getByRole('gridcell')).toHaveCount(600);
    await expect(map.getByRole('rowheader').first()).toHaveText(/INV/);
    const legend = page.getByRole('group', { name: 'Legend and verdict filter' });
    await expect(legend.getByRole('button')).not.toHaveCount(0);
    await page.screenshot({ path: screenshotPath(`fleet-map-${viewport.width}`), fullPage: name === 'desktop' });

    // Keyboard: the first cell takes focus, the arrow key moves along the row, Enter opens that string.
    const first = map.getByRole('gridcell').first();
    await first.focus();
    await page.keyboard.press('ArrowRight');
    const focused = page.locator(':focus');
    await expect(focused).toHaveAttribute('role', 'gridcell');
    const label = ((await focused.getAttribute('aria-label')) ?? '').split(/[,:]/)[0]!.trim();
    expect(label).toMatch(/^INV\d+-MPPT\d+-S\d+$/);
    await page.keyboard.press('Enter');
    await expect(page).toHaveURL(/\/strings\/\d+/);
    await expect(page.getByRole('heading', { level: 1 })).toContainText(label);
  });

  test(`dispatcher reads the metrics, each chart with its table (${name})`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await signIn(page, demoUsers.dispatcher, undefined, '/fleet/metrics');
    await expect(page.getByRole('heading', { level: 1, name: 'Metrics' })).toBeVisible();
    const toggles = page.getByRole('button', { name: 'Show as table' });
    await expect(toggles.first()).toBeVisible();
    const charts = await toggles.count();
    expect(charts).toBeGreaterThan(1);
    await page.screenshot({ path: screenshotPath(`fleet-metrics-${viewport.width}`), fullPage: true });

    // The first chart's numbers as a table, with column headers.
    await toggles.first().click();
    await expect(page.getByRole('button', { name: 'Show as chart' }).first()).toHaveAttribute('aria-pressed', 'true');
    const table = page.getByRole('table').first();
    await expect(table).toBeVisible();
    await expect(table.getByRole('columnheader').first()).toBeVisible();
    await expect(table.getByRole('row')).not.toHaveCount(0);
    await page.screenshot({ path: screenshotPath(`fleet-metrics-table-${viewport.width}`), fullPage: true });
  });
}

test('the owner sees the fleet of their own sites only', async ({ page, baseURL }) => {
  const sites = await siteIds(baseURL);
  await page.setViewportSize(viewports.desktop);
  await signIn(page, demoUsers.owner, undefined, `/fleet/sites/${sites.FWM!.id}`);
  await expect(page.getByRole('grid', { name: /String health map of Fenwick Moor Solar/ })).toBeVisible();
  // Open faults count toward energy at risk, but the owner is not sent to tickets they cannot open.
  await page.getByRole('link', { name: /Energy at risk/ }).last().click();
  await expect(page.getByRole('heading', { level: 1, name: 'Energy at risk' })).toBeVisible();
  await expect(page.getByRole('link', { name: /^WO-/ })).toHaveCount(0);

  // Calder Bay belongs to another owner: not found, and not offered.
  await page.goto(`/fleet/sites/${sites.CBD!.id}`);
  await expect(page.getByRole('grid')).toHaveCount(0);
  await expect(page.getByText(/not found|no longer there|not available/i).first()).toBeVisible();
  await page.goto('/fleet');
  await expect(page.getByText('Fenwick Moor Solar').first()).toBeVisible();
  await expect(page.getByText('Calder Bay Distribution Centre')).toHaveCount(0);
  await page.screenshot({ path: screenshotPath('fleet-owner-1280'), fullPage: true });
});
