import { expect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD, demoUsers, viewports } from './helpers.ts';

// The first pages set their text from the core faces (apps/web/plugins/core-fonts.ts, src/fonts.css):
// about 38 KB of font in place of the 70 KB of the packages' Latin files, which a phone on a slow network
// downloads before it can show the page's text. A character outside the core still comes from the
// package's full face, and is still drawn in the app's typeface.

test.use({ viewport: viewports.phone, serviceWorkers: 'block' });

const coreFile = /\/assets\/(inter|space-grotesk)-core-wght-normal-[\w-]+\.woff2$/;

function recordFonts(page: Page): string[] {
  const fonts: string[] = [];
  page.on('request', (request) => {
    if (request.resourceType() === 'font') fonts.push(new URL(request.url()).pathname);
  });
  return fonts;
}

async function signInByApi(page: Page, email: string) {
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const res = await page.request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD }, headers: { 'x-csrf-token': csrfToken } });
  expect(res.ok()).toBe(true);
}

/** Waits until every face the page asked for has arrived and the text is set in it. */
const fontsSettled = (page: Page) => page.evaluate(async () => void (await document.fonts.ready));

for (const [name, path, email] of [
  ['sign-in page', '/sign-in', null],
  ["dispatcher's board", '/work-orders', demoUsers.dispatcher],
  ["technician's Today list", '/', demoUsers.technician],
] as const) {
  test(`the ${name} downloads only the two core faces`, async ({ page }) => {
    if (email) await signInByApi(page, email);
    const fonts = recordFonts(page);
    await page.goto(path);
    await expect(page.locator('main h1')).toBeVisible();
    await page.waitForLoadState('networkidle');
    await fontsSettled(page);
    expect(fonts.sort(), 'font files the page downloaded').toHaveLength(2);
    for (const font of fonts) expect(font).toMatch(coreFile);
  });
}

test("a letter outside the core comes from the package's Latin face, in the app's typeface", async ({ page }) => {
  const fonts = recordFonts(page);
  await page.goto('/sign-in');
  await expect(page.locator('main h1')).toBeVisible();
  await fontsSettled(page);
  expect(fonts.some((f) => /inter-latin-wght/.test(f)), 'the full Latin face before any accented letter is on screen').toBe(false);

  await page.evaluate(() => {
    const p = document.createElement('p');
    p.id = 'accented';
    p.textContent = 'Joaquín Ñúñez';
    document.querySelector('main')!.append(p);
  });
  await expect.poll(() => fonts.some((f) => /\/assets\/inter-latin-wght-normal-[\w-]+\.woff2$/.test(f))).toBe(true);
  await fontsSettled(page);
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('DOM.enable');
  await cdp.send('CSS.enable');
  const { root } = await cdp.send('DOM.getDocument');
  const { nodeId } = await cdp.send('DOM.querySelector', { nodeId: root.nodeId, selector: '#accented' });
  const { fonts: used } = await cdp.send('CSS.getPlatformFontsForNode', { nodeId });
  // Every glyph of the line, "í" and "Ñ" and "ú" included, from Inter: none from a system fallback.
  expect(used.map((f) => [f.familyName, f.isCustomFont])).toEqual([['Inter', true]]);
});
