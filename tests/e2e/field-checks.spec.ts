import { randomUUID } from 'node:crypto';
import { expect, test, type Locator, type Page } from '@playwright/test';
import { simulateString, type ModuleSpec } from '@stringfield/pv';
import {
  apiSignIn,
  demoUsers,
  openDispatchedTicket,
  screenshotPath,
  signIn,
  uniqueSuffix,
  viewports,
  type ApiSession,
} from './helpers.ts';

// Issue 6: the technician's field page on a phone: the DC caution, a check judged as it is typed and
// by the server, readings kept on the phone without signal and sent once, and an I-V trace.

test.use({ viewport: viewports.phone, serviceWorkers: 'block' });

type Ticket = { id: number; number: string; version: number; status: string };
type Check = { id: number; stringId: number; verdict: string; supersededById: number | null };

let dispatcher: ApiSession;
let technician: ApiSession;

test.beforeAll(async ({ baseURL }) => {
  dispatcher = await apiSignIn(demoUsers.dispatcher, { baseURL });
  technician = await apiSignIn(demoUsers.technician, { baseURL });
});
test.afterAll(async () => {
  await dispatcher?.dispose();
  await technician?.dispose();
});

/** A fresh OSR ticket for the demo technician, on strings no other test measures (no peers in common). */
async function ticketFor(labels: string[], options: { isStarted: boolean }): Promise<Ticket> {
  const ticket = await openDispatchedTicket(dispatcher, {
    siteCode: 'OSR',
    labels,
    title: `E2E ${uniqueSuffix()}: field checks on ${labels.join(', ')}`,
  });
  if (!options.isStarted) return ticket;
  return technician.post<Ticket>(`/api/work-orders/${ticket.id}/transitions`, {
    to: 'in_field',
    version: ticket.version,
  });
}

async function serverChecks(ticketId: number, includeSuperseded = false): Promise<Check[]> {
  const { items } = await technician.get<{ items: Check[] }>(
    `/api/work-orders/${ticketId}/checks?includeSuperseded=${includeSuperseded}`,
  );
  return items;
}

async function acknowledgeCaution(page: Page) {
  const caution = page.getByRole('region', { name: 'Before you measure: DC is live in daylight' });
  await expect(caution).toBeVisible();
  await expect(caution).toContainText(
    'Polarity: if the Voc reads negative or the polarity is reversed, stop.',
  );
  await caution.getByRole('button', { name: /I have read this: start today.s checks/ }).click();
  await expect(caution).toBeHidden();
}

/** Conditions and polarity of a reading; the Voc is typed by the caller. */
async function fillConditions(page: Page, conditions: { irradianceWm2: number; moduleTempC: number }) {
  await page.getByRole('textbox', { name: /^Irradiance/ }).fill(String(conditions.irradianceWm2));
  await page.getByLabel('Irradiance measured with').selectOption({ label: 'Reference cell' });
  await page.getByRole('textbox', { name: /^Module temperature/ }).fill(String(conditions.moduleTempC));
  await page.getByLabel('Module temperature taken').selectOption({ label: 'Sensor on the module back' });
  // The choice is a visually hidden radio inside a big label; a pointer lands on the label, so pick
  // it the keyboard's way (which also proves it can be reached without a pointer).
  const polarity = page.getByRole('radio', { name: 'Yes, correct' });
  await polarity.focus();
  await page.keyboard.press('Space');
  await expect(polarity).toBeChecked();
}

/** A description list as term → definition. */
async function factsOf(list: Locator): Promise<Record<string, string>> {
  const terms = await list.getByRole('term').allInnerTexts();
  const values = await list.getByRole('definition').allInnerTexts();
  expect(values).toHaveLength(terms.length);
  return Object.fromEntries(terms.map((t, i) => [t.trim(), values[i]!.trim()]));
}

const readNumber = (text: string) => Number(text.replace(/[^\d.−-]/g, '').replace('−', '-'));

test('a Voc one substring short is judged Fail with the substring finding, in the preview and by the server', async ({
  page,
}) => {
  const label = 'INV06-MPPT5-S1';
  const ticket = await ticketFor([label], { isStarted: false });

  await signIn(page, demoUsers.technician);
  await page
    .getByRole('region', { name: /^(Due today|Later|Overdue), \d+$/ })
    .getByRole('link')
    .filter({ hasText: ticket.number })
    .click();
  await page.getByRole('button', { name: 'Start work' }).click();
  await expect(page.getByText(`Work started on ${ticket.number}`)).toBeVisible();
  await page.getByRole('link', { name: 'Field checks' }).click();

  await expect(page.getByRole('heading', { level: 1, name: 'Field checks' })).toBeVisible();
  await acknowledgeCaution(page);
  await page
    .getByRole('region', { name: 'Strings on this ticket' })
    .getByRole('link')
    .filter({ hasText: label })
    .click();

  const form = page.getByRole('form', { name: `New check of ${label}` });
  await expect(form).toBeVisible();
  await fillConditions(page, { irradianceWm2: 1000, moduleTempC: 25 });
  const voc = page.getByRole('textbox', { name: 'Voc, open-circuit voltage' });
  await voc.fill('1000');

  // The preview states the expected Voc of a healthy string at these conditions, and the string's make-up.
  const preview = page.getByRole('region', { name: 'Preview' });
  const vocRow = preview
    .getByRole('table', { name: 'Measured against expected at the typed conditions' })
    .getByRole('row', { name: /^Voc\b/ });
  const expectedVoc = readNumber(await vocRow.getByRole('cell').nth(1).innerText());
  const makeUp = /(\d+) × (.+)/.exec(await preview.getByText(/^\d+ × /).innerText());
  expect(makeUp, 'the preview names modules in series × module').not.toBeNull();
  const modulesInSeries = Number(makeUp![1]);
  expect(modulesInSeries).toBe(25);
  expect(expectedVoc).toBeGreaterThan(0);
  // One substring is a third of a module (three bypass diodes per module).
  const substringV = expectedVoc / modulesInSeries / 3;
  const measured = (expectedVoc - substringV).toFixed(1);

  await voc.fill(measured);
  await expect(preview.getByText('Preview: Fail')).toBeVisible();
  await expect(preview).toContainText(/about one substring of [\d.]+ V is bypassed/);
  await expect(vocRow.getByRole('cell').nth(0)).toHaveText(
    `${Number(measured).toLocaleString('en-GB', { minimumFractionDigits: 1 })} V`,
  );
  // A screen's worth with the preview on top: in a full-page picture the sticky Save bar would sit over it.
  await preview.evaluate((el) => {
    el.scrollIntoView({ block: 'start' });
    window.scrollBy(0, -80);
  });
  await page.screenshot({ path: screenshotPath('field-checks-form-preview-360') });

  await form.getByRole('button', { name: 'Save check' }).click();
  const saved = page.getByRole('region', { name: 'Saved verdict' });
  await expect(saved).toBeVisible();
  await expect(saved.getByText('Fail', { exact: true })).toBeVisible();
  const finding = saved
    .getByRole('list', { name: 'Findings' })
    .getByRole('listitem')
    .filter({ hasText: 'one substring' });
  await expect(finding).toHaveCount(1);
  const stated = /about one substring of ([\d.]+) V is bypassed/.exec(await finding.innerText());
  expect(stated).not.toBeNull();
  expect(Math.abs(Number(stated![1]) - substringV)).toBeLessThanOrEqual(0.1);
  await expect(saved).toContainText(
    `Voc measured${Number(measured).toLocaleString('en-GB', { minimumFractionDigits: 1 })} V`,
  );

  // The server holds exactly this one check, with the same verdict.
  const checks = await serverChecks(ticket.id);
  expect(checks).toHaveLength(1);
  expect(checks[0]!.verdict).toBe('fail');
  await page.screenshot({ path: screenshotPath('field-checks-saved-verdict-360'), fullPage: true });
});

test('two checks saved without signal are queued on the phone and arrive exactly once when it returns', async ({
  page,
  context,
}) => {
  const labels = ['INV07-MPPT6-S1', 'INV07-MPPT6-S2'];
  const ticket = await ticketFor(labels, { isStarted: true });

  await signIn(page, demoUsers.technician, undefined, `/work-orders/${ticket.id}/field`);
  await acknowledgeCaution(page);
  const list = page.getByRole('region', { name: 'Strings on this ticket' });
  for (const label of labels)
    await expect(list.getByRole('link').filter({ hasText: label })).toContainText('No check yet');

  // The first string's form is open (and both datasheets on the phone) before the signal goes.
  await list.getByRole('link').filter({ hasText: labels[0] }).click();
  await expect(page.getByRole('form', { name: `New check of ${labels[0]}` })).toBeVisible();
  await context.setOffline(true);
  await expect(page.getByText('No connection', { exact: true })).toBeVisible();

  const vocs = ['1238.5', '1241.0'];
  for (const [index, label] of labels.entries()) {
    if (index > 0) {
      await page.getByRole('button', { name: 'All strings' }).click();
      await list.getByRole('link').filter({ hasText: label }).click();
    }
    const form = page.getByRole('form', { name: `New check of ${label}` });
    await expect(form).toBeVisible();
    await fillConditions(page, { irradianceWm2: 1000, moduleTempC: 25 });
    await page.getByRole('textbox', { name: 'Voc, open-circuit voltage' }).fill(vocs[index]!);
    await form.getByRole('button', { name: 'Save check' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'Kept on this phone' })).toBeVisible();
    await expect(
      page.getByRole('link', {
        name: `${index + 1} reading${index === 0 ? '' : 's'} on this phone, not yet sent: show them`,
      }),
    ).toBeVisible();
  }

  // The queued badge and the list of what waits, in the order taken.
  await expect(page.getByRole('link', { name: /2 readings on this phone, not yet sent/ })).toContainText(
    '2 waiting to send',
  );
  const queue = page.getByRole('region', { name: 'On this phone, not yet on the server' });
  await expect(queue.getByRole('listitem')).toHaveCount(2);
  await expect(queue.getByRole('listitem').nth(0)).toContainText(`${labels[0]} · Voc 1,238.5 V`);
  await expect(queue.getByRole('listitem').nth(1)).toContainText(`${labels[1]} · Voc 1,241.0 V`);
  await expect(queue.getByRole('button', { name: 'Send now' })).toBeDisabled();
  expect(await serverChecks(ticket.id), 'nothing reached the server while offline').toHaveLength(0);
  await page.screenshot({ path: screenshotPath('field-checks-offline-queue-360'), fullPage: true });

  // Signal again: both are sent on their own, once each.
  await context.setOffline(false);
  await expect(page.getByRole('link', { name: /on this phone, not yet sent/ })).toHaveCount(0, {
    timeout: 15_000,
  });
  await expect(queue).toBeHidden();
  await expect.poll(async () => (await serverChecks(ticket.id, true)).length, { timeout: 10_000 }).toBe(2);
  await page.getByRole('button', { name: 'All strings' }).click();
  for (const label of labels) {
    await expect(list.getByRole('link').filter({ hasText: label })).toContainText(/Voc 1,2\d\d\.\d V/);
  }
  // Give any stray second send a moment to land, then count again: still one check per string.
  await page.waitForTimeout(1500);
  const checks = await serverChecks(ticket.id, true);
  expect(checks).toHaveLength(2);
  expect(new Set(checks.map((c) => c.stringId)).size).toBe(2);
  await page.screenshot({ path: screenshotPath('field-checks-after-sync-360'), fullPage: true });
});

/** A small, repeatable pseudo-random source (mulberry32), so the noise is the same on every run. */
function random(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

test('an I-V trace CSV uploaded to a saved check is analysed and drawn', async ({ page }) => {
  const label = 'INV05-MPPT6-S3';
  const ticket = await ticketFor([label], { isStarted: true });
  const [stringId] = (
    await technician.get<{ strings: Array<{ id: number; label: string }> }>(`/api/work-orders/${ticket.id}`)
  ).strings.map((s) => s.id);
  const detail = await technician.get<{
    modulesInSeries: number;
    module: ModuleSpec & { noctC: number | null };
  }>(`/api/strings/${stringId}`);
  const { noctC, ...rest } = detail.module;
  const module: ModuleSpec = {
    pmaxW: rest.pmaxW,
    vocV: rest.vocV,
    iscA: rest.iscA,
    vmpV: rest.vmpV,
    impA: rest.impA,
    alphaIscPctPerC: rest.alphaIscPctPerC,
    betaVocPctPerC: rest.betaVocPctPerC,
    gammaPmaxPctPerC: rest.gammaPmaxPctPerC,
    cellsInSeries: rest.cellsInSeries,
    bypassDiodes: rest.bypassDiodes,
    ...(noctC === null ? {} : { noctC }),
  };

  // GENERATED test data, not a field measurement: a healthy string modelled by @stringfield/pv at
  // 850 W/m² and 47 °C, with a little seeded noise on both axes, written as a tracer's CSV export.
  const conditions = { irradianceWm2: 850, moduleTempC: 47 };
  const model = simulateString({ module, modulesInSeries: detail.modulesInSeries, ...conditions });
  const next = random(20261202);
  const points = model.curve.map((p) => ({
    voltageV: Math.max(0, p.voltageV * (1 + (next() - 0.5) * 0.001)),
    currentA: Math.max(0, p.currentA + (next() - 0.5) * 0.02),
  }));
  const csv = [
    '# Generated by tests/e2e/field-checks.spec.ts (simulateString + noise), not a measurement',
    `irradiance: ${conditions.irradianceWm2}`,
    `temperature: ${conditions.moduleTempC}`,
    'voltage,current',
    ...points.map((p) => `${p.voltageV.toFixed(2)},${p.currentA.toFixed(3)}`),
  ].join('\n');

  // The reading itself is not what this test is about: it goes in through the API.
  await technician.post(`/api/work-orders/${ticket.id}/checks`, {
    clientId: randomUUID(),
    stringId,
    phase: 'before',
    takenAt: new Date().toISOString(),
    vocV: Number(model.vocV.toFixed(1)),
    iscA: Number(model.iscA.toFixed(2)),
    irradianceWm2: conditions.irradianceWm2,
    irradianceMethod: 'reference_cell',
    moduleTempC: conditions.moduleTempC,
    moduleTempMethod: 'back_sensor',
    polarityCorrect: true,
    instrumentIds: [],
    notes: '',
  });

  await signIn(page, demoUsers.technician, undefined, `/work-orders/${ticket.id}/field?string=${stringId}`);
  await acknowledgeCaution(page);
  await expect(page.getByRole('heading', { level: 2, name: label })).toBeVisible();
  await expect(page.getByRole('region', { name: 'Saved verdict' })).toBeVisible();

  const trace = page.getByRole('region', { name: 'I-V trace' });
  await trace.getByLabel('CSV from the I-V tracer').setInputFiles({
    name: 'iv-trace-generated.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(csv, 'utf8'),
  });
  await trace.getByRole('button', { name: 'Upload and analyse' }).click();
  await expect(page.getByText('I-V trace analysed')).toBeVisible();

  await expect(trace).toContainText(
    `iv-trace-generated.csv · 850 W/m² · 47.0 °C cell · ${points.length} points`,
  );
  // The chart is hidden from assistive technology (the panel says the same in words), so it is
  // found by its drawing: three curves (measured, healthy model, translated to STC).
  const chart = trace.locator('.recharts-wrapper > svg.recharts-surface');
  await expect(chart).toBeVisible();
  await expect(chart.locator('.recharts-line-curve')).toHaveCount(3);
  const box = await chart.boundingBox();
  expect(box!.width).toBeGreaterThan(250);
  expect(box!.height).toBeGreaterThan(200);

  // The server's analysis of the generated curve agrees with the model it came from.
  const facts = await factsOf(trace);
  expect(Math.abs(readNumber(facts['Pmp measured']!) / model.pmpW - 1)).toBeLessThan(0.02);
  expect(facts['Likely bypassed substrings']).toBe('0');
  expect(readNumber(facts['Pmp of a healthy string']!) / model.pmpW).toBeCloseTo(1, 1);
  // Keep the pointer off the chart, so no tooltip covers the curves in the picture.
  await page.mouse.move(0, 0);
  await page.screenshot({ path: screenshotPath('field-checks-iv-trace-360'), fullPage: true });
});
