import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { demoUsers, screenshotPath, signIn, uniqueSuffix, viewports } from './helpers.ts';

// The staged start-up (apps/web/src/main.tsx) loads the app's code in steps; a step whose file does
// not arrive (gone after a release, the connection dropping) must end in a message with a way on, not
// in a loading frame that never changes. The same for the background check queue sync: its file
// failing leaves the page usable.

test.use({ viewport: viewports.phone, serviceWorkers: 'block' });

test('a start-up file that does not arrive ends in a message with a Reload button, and Reload starts the app', async ({
  page,
}) => {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  // The app start-up chunk (src/app/start.tsx: providers, router), asked for by main.tsx's second step.
  await page.route(/\/assets\/start-[\w-]+\.js$/, (route) => route.abort('internetdisconnected'));
  await page.goto('/sign-in');

  const alert = page.getByRole('alert').filter({ hasText: 'Stringfield did not start' });
  await expect(alert).toBeVisible();
  await expect(alert).toContainText('Part of the app did not download');
  const reload = alert.getByRole('button', { name: 'Reload' });
  await expect(reload).toBeVisible();
  await expect(reload).toBeFocused();
  // A thumb-sized target on a phone.
  const box = await reload.boundingBox();
  expect(box?.height ?? 0).toBeGreaterThanOrEqual(48);
  expect(box?.width ?? 0).toBeGreaterThanOrEqual(48);
  // No longer announced as loading.
  await expect(page.getByRole('status', { name: /loading/i })).toHaveCount(0);
  await expect(page.getByText('Loading Stringfield')).toHaveCount(0);
  expect(errors, 'the failure is handled, not an uncaught rejection').toEqual([]);

  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  await page.screenshot({ path: screenshotPath('start-up-failure-360') });

  // The file is there again: Reload starts the app.
  await page.unroute(/\/assets\/start-[\w-]+\.js$/);
  await reload.click();
  await expect(page.getByLabel('E-mail')).toBeVisible();
  await expect(page.getByRole('alert').filter({ hasText: 'Stringfield did not start' })).toHaveCount(0);
});

test('the technician’s pages keep working when the check queue sync does not load', async ({ page }) => {
  await page.route(/\/assets\/check-queue-sync-[\w-]+\.js$/, (route) => route.abort('internetdisconnected'));
  await signIn(page, demoUsers.technician);

  // The failure has happened (and was caught) once the notice shows; the page is still the page.
  const notice = page
    .getByRole('status')
    .filter({ hasText: 'Saved checks are not sent until the app reloads' });
  await expect(notice).toBeVisible();
  await expect(notice.getByRole('button', { name: 'Reload' })).toBeVisible();
  await expect(page.getByText('This page ran into a problem')).toHaveCount(0);
  await expect(page.getByRole('main').getByRole('heading', { level: 1 })).toBeVisible();
  await page.screenshot({ path: screenshotPath('check-queue-sync-failure-360') });
  // The navigation still works around it.
  await page
    .getByRole('navigation', { name: 'Main' })
    .filter({ visible: true })
    .getByRole('link', { name: 'Work orders' })
    .click();
  await expect(page).toHaveURL(/\/work-orders/);
  await expect(page.getByText('This page ran into a problem')).toHaveCount(0);
});

test('when the toaster’s file does not arrive, the page works on and its toasts show once the file comes', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  // apps/web/src/app/provider.tsx: the toaster downloads once the first page has settled; here without signal.
  const toasterFile = /\/assets\/app-toaster-[\w-]+\.js$/;
  let refused = 0;
  await page.route(toasterFile, (route) => {
    refused += 1;
    return route.abort('internetdisconnected');
  });
  await signIn(page, demoUsers.technician, undefined, '/instruments');
  await expect(page.getByRole('heading', { level: 1, name: 'Instruments' })).toBeVisible();
  await expect.poll(() => refused, { message: 'the toaster was asked for once the page settled' }).toBeGreaterThan(0);

  // An action whose toast has no toaster yet: the action itself goes through and the page stays the page.
  const serial = `TOAST-${uniqueSuffix()}`;
  await page.getByRole('button', { name: 'Add instrument' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Kind').selectOption({ label: 'Multimeter' });
  await dialog.getByLabel('Serial number').fill(serial);
  await dialog.getByLabel('Calibration due on').fill('2027-06-30');
  await dialog.getByRole('button', { name: 'Add instrument' }).click();
  await expect(page.getByRole('button', { name: `Archive ${serial}` })).toBeVisible();
  await expect(page.getByText(`${serial} added to the register`)).toHaveCount(0);
  await expect(page.getByText('This page ran into a problem')).toHaveCount(0);
  // Past the latest moment the app asks for the toaster (load + 1 s + up to 2 s for an idle moment), so
  // that its download has failed rather than not yet begun.
  await page.waitForTimeout(3_500);
  await expect(page.getByText(`${serial} added to the register`)).toHaveCount(0);

  // The signal is back: the toaster downloads, and the toast that waited shows.
  await page.unroute(toasterFile);
  await page.evaluate(() => window.dispatchEvent(new Event('online')));
  await expect(page.getByText(`${serial} added to the register`)).toBeVisible();
  expect(errors, 'the failed download is handled, not an uncaught rejection').toEqual([]);

  // Out of the pickers of the other tests.
  await page.getByRole('button', { name: `Archive ${serial}` }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Archive instrument' }).click();
  await expect(page.getByText(`${serial} archived`)).toBeVisible();
});
