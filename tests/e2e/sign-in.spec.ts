import { expect, test } from '@playwright/test';
import { roles } from '@stringfield/shared';
import { navItemsFor, phoneTabsFor, PHONE_TAB_LIMIT } from '../../apps/web/src/app/nav.ts';
import { demoUsers, screenshotPath, signIn, viewports } from './helpers.ts';

for (const [device, viewport] of Object.entries(viewports)) {
  test.describe(`${device} (${viewport.width} px)`, () => {
    test.use({ viewport });

    for (const role of roles) {
      test(`${role} signs in and sees the navigation of the role`, async ({ page }) => {
        await signIn(page, demoUsers[role]);
        const nav = page.getByRole('navigation', { name: 'Main' }).filter({ visible: true });
        if (viewport.width >= 1024) {
          // Desktop rail: every item the permission table allows, and nothing else.
          const expected = navItemsFor(role).map((i) => i.label);
          for (const label of expected) await expect(nav.getByRole('link', { name: label })).toBeVisible();
          const shown = await nav.getByRole('link').allInnerTexts();
          expect(shown.map((t) => t.trim()).filter(Boolean)).toHaveLength(expected.length);
        } else {
          // Phone tab bar: the role's first tabs, the rest behind "More".
          const { tabs, more } = phoneTabsFor(role, PHONE_TAB_LIMIT);
          for (const item of tabs) await expect(nav.getByRole('link', { name: item.label })).toBeVisible();
          if (more.length) {
            await nav.getByRole('button', { name: /more/i }).click();
            for (const item of more) await expect(page.getByRole('dialog').getByRole('link', { name: item.label })).toBeVisible();
            await page.screenshot({ path: screenshotPath(`sign-in-${role}-${viewport.width}-more`) });
            await page.keyboard.press('Escape');
          }
        }
        // Admin-only pages are neither linked nor reachable for the other roles.
        if (role !== 'admin') {
          await expect(page.getByRole('link', { name: 'People' })).toHaveCount(0);
          await page.goto('/people');
          await expect(page.getByText(/not available for your role/i)).toBeVisible();
          await page.goto('/');
        }
        await page.screenshot({ path: screenshotPath(`sign-in-${role}-${viewport.width}`), fullPage: true });
      });
    }
  });
}

test('a wrong password is answered on the form and nothing else happens', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demoUsers.dispatcher);
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page.getByText(/e-mail or password not recognised/i)).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});

test('a deep link survives sign-in', async ({ page }) => {
  await signIn(page, demoUsers.admin, undefined, '/people?role=technician');
  await expect(page).toHaveURL(/\/people\?.*role=technician/);
});
