import { expect, test, type Locator, type Page } from '@playwright/test';
import { demoUsers, screenshotPath, signIn, uniqueSuffix, viewports } from './helpers.ts';

// Issue 4: a dispatcher imports a string layout from a CSV (checked first, row by row), and the
// string page shows the sizing checks of a string against its inverter input and the site's climate.

const header =
  'label,inverter,mppt_input,combiner,position,module_model,modules_in_series,strings_in_parallel';

/** A layout CSV for Calder Bay (SDI-25K-2 inverters, 18 × SDM-330-60P); `badModel` breaks the second row. */
function layoutCsv(labels: readonly string[], badModel?: string): Buffer {
  const rows = labels.map((label, index) => {
    const model = index === 1 && badModel ? badModel : 'SDM-330-60P';
    return [label, 'INV10', String(1 + (index % 2)), '', '', model, '18', '2'].join(',');
  });
  return Buffer.from([header, ...rows].join('\r\n') + '\r\n', 'utf8');
}

/** The cell of `row` under the column headed `column` of the same table. */
async function cellUnder(table: Locator, row: Locator, column: string): Promise<Locator> {
  const headers = (await table.getByRole('columnheader').allInnerTexts()).map((t) => t.trim());
  const index = headers.indexOf(column);
  expect(index, `a column headed ${column}`).toBeGreaterThanOrEqual(0);
  // A row header (the preview's line number) comes before the cells.
  const rowHeaders = await row.getByRole('rowheader').count();
  return row.getByRole('cell').nth(index - rowHeaders);
}

async function openSite(page: Page, name: string) {
  await page
    .getByRole('navigation', { name: 'Main' })
    .filter({ visible: true })
    .getByRole('link', { name: 'Sites' })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: 'Sites' })).toBeVisible();
  await page
    .getByRole('link', { name: new RegExp(`^${name}`) })
    .filter({ visible: true })
    .click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
}

test.describe('layout import and string sizing', () => {
  test.use({ viewport: viewports.desktop });

  test('a CSV with a bad row is refused row by row; the corrected file imports every string', async ({
    page,
  }) => {
    const suffix = uniqueSuffix();
    const labels = [1, 2, 3].map((n) => `INV10-E2E${suffix}-S${n}`);
    const badModel = 'SDM-999-XX';

    await signIn(page, demoUsers.dispatcher);
    await openSite(page, 'Calder Bay Distribution Centre');
    await page.getByRole('link', { name: 'Import layout' }).first().click();
    await expect(page.getByRole('heading', { level: 1, name: 'Import string layout' })).toBeVisible();

    // 1. The file with an unknown module model on its second row (line 3 of the file).
    await page
      .getByLabel('Choose a CSV file')
      .setInputFiles({ name: 'cbd-layout.csv', mimeType: 'text/csv', buffer: layoutCsv(labels, badModel) });
    const review = page.getByRole('region', { name: '3. Review and import' });
    await expect(review).toBeVisible();
    await expect(review.getByText('1 row has errors: nothing can be imported yet')).toBeVisible();
    await expect(review.getByRole('definition').nth(0)).toHaveText('3'); // Rows
    await expect(review.getByRole('definition').nth(1)).toHaveText('2'); // Ready
    await expect(review.getByRole('definition').nth(2)).toHaveText('1'); // With errors
    await expect(review.getByRole('button', { name: 'Import 2 strings' })).toBeDisabled();

    const table = review.getByRole('table', { name: 'Rows of cbd-layout.csv' });
    const badRow = table
      .getByRole('row')
      .filter({ has: page.getByRole('rowheader', { name: '3', exact: true }) });
    await expect(badRow).toHaveCount(1);
    await expect(badRow).toContainText('1 error');
    const modelCell = await cellUnder(table, badRow, 'Module model');
    await expect(modelCell).toContainText(badModel);
    await expect(modelCell).toContainText(
      `Error: Unknown module model "${badModel}"; add it to the library first`,
    );
    // The neighbouring cells of that row carry no error, and the good rows are ready.
    await expect(await cellUnder(table, badRow, 'Label')).not.toContainText('Error');
    const goodRow = table
      .getByRole('row')
      .filter({ has: page.getByRole('rowheader', { name: '2', exact: true }) });
    await expect(goodRow).toContainText('Ready');
    await page.screenshot({ path: screenshotPath('assets-import-preview-error-1280'), fullPage: true });

    // 2. The corrected file: every row ready, and the import goes through.
    await page
      .getByLabel('Choose another file')
      .setInputFiles({ name: 'cbd-layout-fixed.csv', mimeType: 'text/csv', buffer: layoutCsv(labels) });
    await expect(review.getByRole('table', { name: 'Rows of cbd-layout-fixed.csv' })).toBeVisible();
    await expect(review.getByText(/rows? ha(s|ve) errors/)).toHaveCount(0);
    const importButton = review.getByRole('button', { name: 'Import 3 strings' });
    await expect(importButton).toBeEnabled();
    await importButton.click();

    await expect(page.getByText('3 strings imported into CBD')).toBeVisible();
    await expect(page).toHaveURL(/\/sites\/\d+$/);
    await expect(
      page.getByRole('heading', { level: 1, name: 'Calder Bay Distribution Centre' }),
    ).toBeVisible();

    // The site lists the new strings (search narrows the list to them).
    await page.getByRole('searchbox', { name: 'Search labels' }).fill(`E2E${suffix}`);
    const strings = page.getByRole('table', { name: 'Strings of CBD' });
    for (const label of labels)
      await expect(strings.getByRole('link', { name: label, exact: true })).toBeVisible();
    await expect(strings.getByRole('row')).toHaveCount(1 + labels.length);
    const first = strings
      .getByRole('row')
      .filter({ has: page.getByRole('link', { name: labels[0], exact: true }) });
    await expect(first).toContainText('INV10 · MPPT 1');
    await expect(first).toContainText('18 × SDM-330-60P');
  });

  test('a 28-module string of OSR INV08 fails the cold-Voc check, on a desktop and on a phone', async ({
    page,
  }) => {
    await signIn(page, demoUsers.dispatcher);
    await openSite(page, 'Ostrander Ridge Solar');
    await page.getByRole('link', { name: /^INV08\b/ }).click();
    await expect(page.getByRole('heading', { level: 2, name: 'Strings of INV08' })).toBeVisible();
    await page
      .getByRole('table', { name: 'Strings of OSR, INV08' })
      .getByRole('link', { name: 'INV08-MPPT1-S1', exact: true })
      .click();

    await expect(page.getByRole('heading', { level: 1, name: 'INV08-MPPT1-S1' })).toBeVisible();
    await expect(
      page.getByText(/^28 × Stringfield Demo Modules SDM-405-72M on INV08 input 1$/),
    ).toBeVisible();
    await expect(page.getByText(/^Fails \d sizing checks?$/)).toBeVisible();

    const checks = page.getByRole('table', { name: 'Sizing checks' });
    const coldVoc = checks.getByRole('row').filter({ hasText: 'Cold Voc under the inverter maximum' });
    await expect(coldVoc).toHaveCount(1);
    await expect(coldVoc).toContainText('Not met');
    // The value is the string's Voc at the record cold of the site, above the 1,500 V limit.
    const coldVocValue = Number(
      (await (await cellUnder(checks, coldVoc, 'Value')).innerText()).replace(/[^\d.]/g, ''),
    );
    expect(coldVocValue).toBeGreaterThan(1500);
    await expect(await cellUnder(checks, coldVoc, 'Limit')).toContainText(/1[,\s.\u202f]?500/);
    await page.screenshot({ path: screenshotPath('assets-string-inv08-1280'), fullPage: true });

    // On a phone the checks are cards; the failing one still says so in words.
    await page.setViewportSize(viewports.phone);
    const cards = page.getByRole('list', { name: 'Sizing checks' });
    await expect(cards).toBeVisible();
    const card = cards.getByRole('listitem').filter({ hasText: 'Cold Voc under the inverter maximum' });
    await expect(card).toContainText('Not met');
    await expect(page.getByRole('heading', { level: 1, name: 'INV08-MPPT1-S1' })).toBeInViewport();
    await page.screenshot({ path: screenshotPath('assets-string-inv08-360'), fullPage: true });
  });
});
