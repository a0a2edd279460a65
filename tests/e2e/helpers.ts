import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'stringfield-demo';
export const demoUsers = {
  admin: 'admin@stringfield.test',
  dispatcher: 'dispatcher@stringfield.test',
  technician: 'tech@stringfield.test',
  supervisor: 'supervisor@stringfield.test',
  owner: 'owner@stringfield.test',
} as const;

export const viewports = {
  phone: { width: 360, height: 780 },
  desktop: { width: 1280, height: 800 },
} as const;

/** Sign in through the form, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD, path = '/') {
  await page.goto(path);
  await expect(page).toHaveURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).not.toHaveURL(/\/sign-in/);
}

export function screenshotPath(name: string) {
  return `tests/e2e/screenshots/${name}.png`;
}
