import { expect, test } from '@playwright/test';
import { classifyThermalAnomaly } from '@stringfield/pv';
import {
  apiSignIn,
  demoUsers,
  makeJpeg,
  openDispatchedTicket,
  screenshotPath,
  signIn,
  uniqueSuffix,
  viewports,
  type ApiSession,
} from './helpers.ts';

// Issue 7: the technician's evidence on a phone: photos uploaded one by one with their tags, a
// thermal finding classified by the server, and a bypass-diode record linked to gallery photos.

test.use({ viewport: viewports.phone, serviceWorkers: 'block' });

type Ticket = { id: number; number: string; version: number; status: string };
type Photo = { id: number; tag: string; stringId: number | null; caption: string; thermal: { classOfAbnormality: number | null } | null };
type DiodeRecord = { id: number; missing: string[]; beforePhotoId: number | null; afterPhotoId: number | null };

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

test('photos upload one by one, a hot junction box is CoA 3, and a diode record links gallery photos', async ({ page }) => {
  // A string no other test touches (FWM inverter 20), on a fresh ticket already in the field.
  const label = 'INV20-MPPT4-S1';
  const dispatched = await openDispatchedTicket(dispatcher, {
    siteCode: 'FWM',
    labels: [label],
    title: `E2E ${uniqueSuffix()}: evidence on ${label}`,
  });
  const ticket = await technician.post<Ticket>(`/api/work-orders/${dispatched.id}/transitions`, {
    to: 'in_field',
    version: dispatched.version,
  });
  expect(ticket.status).toBe('in_field');

  await signIn(page, demoUsers.technician, undefined, `/work-orders/${ticket.id}`);
  const photosPanel = page.getByRole('region', { name: 'Photos' });
  await expect(photosPanel.getByRole('heading', { name: 'No photos yet' })).toBeVisible();

  // ---- Three files through the "Choose from library" input: two photos and a thermal image.
  const files = [
    { name: 'jb-before.jpg', tag: 'Before repair', caption: 'Junction box before', colour: { r: 120, g: 90, b: 60 } },
    { name: 'jb-after.jpg', tag: 'After repair', caption: 'Junction box after', colour: { r: 60, g: 130, b: 80 } },
    { name: 'jb-thermal.jpg', tag: 'Thermal image', caption: 'Hot junction box', colour: { r: 200, g: 40, b: 160 } },
  ];
  const buffers = await Promise.all(files.map((f) => makeJpeg(f.colour)));
  await expect(photosPanel.getByRole('button', { name: 'Choose from library' })).toBeVisible();
  await photosPanel
    .locator('input[type="file"]:not([capture])')
    .setInputFiles(files.map((f, i) => ({ name: f.name, mimeType: 'image/jpeg', buffer: buffers[i]! })));

  const queue = photosPanel.getByRole('list', { name: 'Photos to upload' });
  await expect(queue.getByRole('listitem')).toHaveCount(3);
  for (const f of files) {
    const details = queue.getByRole('group', { name: `Details of ${f.name}` });
    await details.getByLabel('Tag').selectOption({ label: f.tag });
    // The ticket's only string is picked already.
    await expect(details.getByLabel('String')).toHaveValue(/^\d+$/);
    await expect(details.getByLabel('String').locator('option:checked')).toHaveText(label);
    await details.getByLabel('Module position').fill('7');
    await details.getByLabel('Caption').fill(f.caption);
  }
  await page.screenshot({ path: screenshotPath('evidence-upload-queue-360'), fullPage: true });
  await photosPanel.getByRole('button', { name: 'Upload 3 photos' }).click();

  // Each file says for itself that it arrived.
  for (const f of files) {
    const row = queue.getByRole('listitem').filter({ hasText: f.name });
    await expect(row.getByText('Uploaded', { exact: true })).toBeVisible();
  }
  await expect(page.getByRole('status').filter({ hasText: '3 photos uploaded.' })).toHaveCount(1);
  const stored = await technician.get<{ items: Photo[] }>(`/api/work-orders/${ticket.id}/photos`);
  expect(stored.items.map((p) => [p.tag, p.caption]).sort()).toEqual([
    ['after', 'Junction box after'],
    ['before', 'Junction box before'],
    ['thermal', 'Hot junction box'],
  ]);
  await page.screenshot({ path: screenshotPath('evidence-uploaded-360'), fullPage: true });

  // ---- The thermal finding: 71 °C against 43 °C at 820 W/m² on the junction box.
  const thermalForm = photosPanel.getByRole('form', { name: 'Thermal finding' });
  await expect(thermalForm).toBeVisible();
  await thermalForm.getByLabel('Hottest spot (°C)').fill('71');
  await thermalForm.getByLabel('Reference, healthy area (°C)').fill('43');
  await thermalForm.getByLabel('Irradiance in the module plane (W/m²)').fill('820');
  await thermalForm.getByLabel('Pattern').selectOption({ label: 'Junction box' });
  await expect(thermalForm.getByLabel('Module position')).toHaveValue('7');
  await expect(thermalForm).toContainText('ΔT 28.0 K (hottest − reference)');
  await expect(thermalForm.getByText('Conditions too poor')).toHaveCount(0);
  await thermalForm.getByRole('button', { name: 'Classify and save' }).click();
  await expect(thermalForm).toBeHidden();

  const expected = classifyThermalAnomaly({ deltaTC: 28, irradianceWm2: 820, pattern: 'warm-junction-box', maxTempC: 71 });
  expect(expected.classOfAbnormality).toBe(3);
  await expect(photosPanel.getByText('CoA 3 — Safety-relevant abnormality')).toBeVisible();
  await expect(photosPanel.getByText(expected.reason, { exact: true })).toBeVisible();
  expect(expected.reason).toContain('a hot junction box is a fire risk');
  await expect(photosPanel.getByRole('button', { name: 'Change the finding' })).toBeVisible();
  const thermalPhoto = (await technician.get<{ items: Photo[] }>(`/api/work-orders/${ticket.id}/photos`)).items.find(
    (p) => p.tag === 'thermal',
  );
  expect(thermalPhoto?.thermal?.classOfAbnormality).toBe(3);
  await photosPanel.getByText('CoA 3 — Safety-relevant abnormality').scrollIntoViewIfNeeded();
  await page.screenshot({ path: screenshotPath('evidence-thermal-coa3-360') });

  // ---- The bypass-diode replacement, its photos picked from the ticket's gallery.
  const diodes = page.getByRole('region', { name: 'Bypass-diode replacements' });
  await diodes.getByRole('button', { name: 'Record a diode replacement' }).click();
  await expect(diodes.getByRole('note', { name: 'Before you open a junction box' })).toBeVisible();
  const form = diodes.getByRole('form', { name: 'Record a diode replacement' });
  await expect(form.getByLabel('String')).toHaveValue(/^\d+$/);
  await form.getByLabel('Module position').fill('7');
  await form.getByLabel('Module serial').fill('SDM550-0007731');
  await form.getByLabel('Diode position').fill('2');
  await form.getByLabel('Failure found').selectOption({ label: 'Shorted' });
  await form.getByLabel('How it was found').selectOption({ label: 'Thermal image' });
  const removed = form.getByRole('group', { name: 'Removed diode' });
  await removed.getByLabel('Part number').fill('SBR20A45');
  const installed = form.getByRole('group', { name: 'Installed diode' });
  await installed.getByLabel('Part number').fill('SBR25A45');
  await installed.getByLabel('Current rating (A)').fill('25');
  await installed.getByLabel('Voltage rating (V)').fill('45');
  await installed.getByLabel('Forward voltage of the new diode (V)').fill('0,42');
  await form.getByLabel('Voc before (V)').fill('1131.5');
  await form.getByLabel('Voc after (V)').fill('1147.8');
  for (const [field, caption] of [
    ['Photo before', 'Junction box before'],
    ['Photo after', 'Junction box after'],
  ] as const) {
    const select = form.getByLabel(field);
    const option = select.locator('option', { hasText: caption });
    await expect(option).toHaveCount(1);
    await select.selectOption((await option.getAttribute('value')));
  }
  // The matching tag is listed first.
  await expect(form.getByLabel('Photo after').locator('option').nth(1)).toContainText('After repair');
  await form.getByRole('button', { name: 'Record the replacement' }).click();
  await expect(form).toBeHidden();

  await expect(diodes.getByRole('status')).toHaveText('Diode replacement saved: complete.');
  const card = diodes.getByRole('article', { name: `${label} · module 7 · diode 2` });
  await expect(card).toBeVisible();
  await expect(card.getByText('Complete', { exact: true })).toBeVisible();
  await expect(card.getByText('Incomplete', { exact: true })).toHaveCount(0);
  await expect(card.getByText('Missing:')).toHaveCount(0);
  await expect(card).toContainText('1131.5 V → 1147.8 V');
  // "0,42" typed with a decimal comma is read as 0.42 V.
  await expect(card).toContainText('Vf 0.42 V');
  await expect(card.getByRole('link', { name: /^Before\s*: Junction box before \(before repair of / })).toBeVisible();
  await expect(card.getByRole('link', { name: /^After\s*: Junction box after \(after repair of / })).toBeVisible();
  const records = await technician.get<{ items: DiodeRecord[] }>(`/api/work-orders/${ticket.id}/diode-replacements`);
  expect(records.items).toHaveLength(1);
  expect(records.items[0]!.missing).toEqual([]);
  const byCaption = new Map(stored.items.map((p) => [p.caption, p.id]));
  expect(records.items[0]!.beforePhotoId).toBe(byCaption.get('Junction box before'));
  expect(records.items[0]!.afterPhotoId).toBe(byCaption.get('Junction box after'));
  await card.scrollIntoViewIfNeeded();
  await page.screenshot({ path: screenshotPath('evidence-diode-record-360'), fullPage: true });
});
