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

test('sign out everywhere ends the session on the other device too', async ({ browser }) => {
  const phone = await browser.newContext({ viewport: viewports.phone });
  const laptop = await browser.newContext({ viewport: viewports.desktop });
  try {
    const onPhone = await phone.newPage();
    const onLaptop = await laptop.newPage();
    await signIn(onPhone, demoUsers.supervisor);
    await signIn(onLaptop, demoUsers.supervisor, undefined, '/settings');
    await onPhone.goto('/settings');
    await onPhone.getByRole('heading', { name: 'Signed-in devices' }).scrollIntoViewIfNeeded();
    await onPhone.screenshot({ path: screenshotPath('sign-out-everywhere-360') });

    await onLaptop.getByRole('button', { name: 'Sign out everywhere' }).click();
    const dialog = onLaptop.getByRole('dialog', { name: 'Sign out on every device?' });
    await expect(dialog).toBeVisible();
    await onLaptop.screenshot({ path: screenshotPath('sign-out-everywhere-1280') });
    await dialog.getByRole('button', { name: 'Sign out everywhere' }).click();
    await expect(onLaptop).toHaveURL(/\/sign-in/);

    await onPhone.reload();
    await expect(onPhone).toHaveURL(/\/sign-in/);
  } finally {
    await phone.close();
    await laptop.close();
  }
});

test('after sign-out nothing of the person is on screen: their page goes at once, and never shows again', async ({ browser }) => {
  // A shared site-office PC: the next person must not see the last one's name, not even while the
  // sign-in page loads.
  const context = await browser.newContext({ viewport: viewports.desktop, serviceWorkers: 'block' });
  try {
    const page = await context.newPage();
    await signIn(page, demoUsers.technician);
    const name = (await page.request.get('/api/auth/me').then((r) => r.json()) as { user: { name: string } }).user.name;
    await expect(page.getByText(name, { exact: true }).first()).toBeVisible();

    // Watches every document of this tab from here on: the signed-in page now, then each one loaded
    // after it. Findings go to sessionStorage, which outlives the page that wrote them.
    const watch = (oldName: string) => {
      const report = (what: string) => {
        const seen = JSON.parse(sessionStorage.getItem('seenName') ?? '[]') as string[];
        sessionStorage.setItem('seenName', JSON.stringify([...seen, `${location.pathname}: ${what}`]));
      };
      const hasName = () => (document.body?.textContent ?? '').includes(oldName);
      // The signed-in page counts from the press on sign out; a page loaded later, from its start.
      let isArmed = !hasName();
      new MutationObserver((records) => {
        if (!isArmed) return;
        for (const record of records)
          for (const node of record.addedNodes)
            if ((node.textContent ?? '').includes(oldName)) report(`${node.nodeName} added`);
      }).observe(document, { childList: true, subtree: true, characterData: true });
      addEventListener('pointerdown', () => (isArmed = true), { capture: true });
      // Whether the name was still on screen when the page went away, that is, when the sign-in
      // page had arrived (seconds, on a slow connection).
      addEventListener('pagehide', () => {
        if (isArmed && hasName()) report('still on screen when the page went away');
      });
    };
    await page.addInitScript(watch, name);
    await page.evaluate(watch, name);

    await page.getByRole('button', { name: 'Sign out' }).filter({ visible: true }).click();
    await expect(page).toHaveURL(/\/sign-in$/);
    await expect(page.getByLabel('E-mail')).toBeVisible();
    await page.waitForLoadState('networkidle');
    await expect(page.getByText(name)).toHaveCount(0);
    const seen = await page.evaluate(() => JSON.parse(sessionStorage.getItem('seenName') ?? '[]') as string[]);
    expect(seen, `where "${name}" was seen after pressing sign out`).toEqual([]);
  } finally {
    await context.close();
  }
});
