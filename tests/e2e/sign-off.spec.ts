import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { expectedString, type ModuleSpec } from '@stringfield/pv';
import {
  apiSignIn,
  currentTicket,
  demoUsers,
  makeJpeg,
  openDispatchedTicket,
  screenshotPath,
  signIn,
  uniqueSuffix,
  viewports,
  type ApiSession,
} from './helpers.ts';

// Issue 8: a supervisor sees exactly what a ticket's evidence lacks, returns it, signs the completed
// ticket off with its digest, and the site's owner gets the signed close-out report as a PDF.

test.use({ serviceWorkers: 'block' });

type Ticket = { id: number; number: string; version: number; status: string };
type StringDetail = { id: number; label: string; modulesInSeries: number; module: ModuleSpec };
type Check = { id: number; verdict: string };
type SignOff = { digest: string; supervisor: { name: string }; comment: string };

const SITE = 'FWM'; // owned by owner@stringfield.test
const LABELS = ['INV21-MPPT5-S1', 'INV21-MPPT5-S2'] as const; // strings no other test touches
const PDF_PATH = 'tests/e2e/screenshots/close-out.pdf';

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

async function transition(api: ApiSession, id: number, to: string, extra: Record<string, unknown> = {}) {
  const { version } = await currentTicket(api, id);
  return api.post<Ticket>(`/api/work-orders/${id}/transitions`, { to, version, ...extra });
}

async function uploadPhoto(ticketId: number, stringId: number, tag: 'before' | 'after', caption: string) {
  const buffer = await makeJpeg({ r: tag === 'after' ? 50 : 140, g: 120, b: 90 });
  const { items } = await technician.postMultipart<{ items: Array<{ id: number; tag: string; stringId: number }> }>(
    `/api/work-orders/${ticketId}/photos`,
    {
      files: { name: `${tag}-${stringId}.jpg`, mimeType: 'image/jpeg', buffer },
      meta: JSON.stringify([{ tag, stringId, modulePosition: null, caption }]),
    },
  );
  expect(items).toHaveLength(1);
  expect(items[0]!.tag).toBe(tag);
  return items[0]!;
}

/** An after check at STC whose Voc and Isc are exactly what a healthy string gives: it must pass. */
async function passingAfterCheck(ticketId: number, string: StringDetail) {
  const expected = expectedString({
    module: string.module,
    modulesInSeries: string.modulesInSeries,
    irradianceWm2: 1000,
    moduleTempC: 25,
  });
  const check = await technician.post<Check>(`/api/work-orders/${ticketId}/checks`, {
    clientId: randomUUID(),
    stringId: string.id,
    phase: 'after',
    takenAt: new Date(Date.now() - 60_000).toISOString(),
    vocV: Math.round(expected.vocV * 10) / 10,
    iscA: Math.round(expected.iscA * 100) / 100,
    irradianceWm2: 1000,
    irradianceMethod: 'reference_cell',
    moduleTempC: 25,
    moduleTempMethod: 'back_sensor',
    polarityCorrect: true,
  });
  expect(check.verdict, `after check of ${string.label}`).toBe('pass');
}

async function newPage(browser: Browser, baseURL: string | undefined, viewport: { width: number; height: number }) {
  const context = await browser.newContext({ baseURL, viewport, serviceWorkers: 'block', acceptDownloads: true });
  return context.newPage();
}

function checklistOf(page: Page) {
  return page.getByRole('region', { name: 'Sign-off' }).getByRole('list', { name: 'Sign-off checklist' });
}

test('a missing after photo blocks sign-off; once added, the supervisor signs off and the owner downloads the PDF', async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(90_000);
  // ---- Set-up through the API: two strings, both after checks pass, an after photo of only the first.
  const dispatched = await openDispatchedTicket(dispatcher, {
    siteCode: SITE,
    labels: LABELS,
    title: `E2E ${uniqueSuffix()}: sign-off of ${LABELS.join(', ')}`,
  });
  const ticketId = dispatched.id;
  const number = dispatched.number;
  await transition(technician, ticketId, 'in_field');
  const detail = await technician.get<{ strings: Array<{ id: number; label: string }> }>(`/api/work-orders/${ticketId}`);
  const strings: StringDetail[] = [];
  for (const label of LABELS) {
    const id = detail.strings.find((s) => s.label === label)!.id;
    strings.push(await technician.get<StringDetail>(`/api/strings/${id}`));
  }
  const [first, second] = strings as [StringDetail, StringDetail];
  for (const s of strings) await passingAfterCheck(ticketId, s);
  await uploadPhoto(ticketId, first.id, 'before', `${first.label} before`);
  await uploadPhoto(ticketId, first.id, 'after', `${first.label} after`);
  await uploadPhoto(ticketId, second.id, 'before', `${second.label} before`);
  expect((await transition(technician, ticketId, 'awaiting_signoff')).status).toBe('awaiting_signoff');

  // ---- Supervisor at 1280: the checklist names the one missing item.
  const supervisor = await newPage(browser, baseURL, viewports.desktop);
  await signIn(supervisor, demoUsers.supervisor, undefined, `/work-orders/${ticketId}`);
  await supervisor.getByRole('link', { name: 'Review and sign off' }).click();
  await expect(supervisor).toHaveURL(/#/);
  const panel = supervisor.getByRole('region', { name: 'Sign-off' });
  const checklist = checklistOf(supervisor);
  await expect(checklist).toBeVisible();
  await expect(panel.getByText('1 item is missing.')).toBeVisible();
  const gates = checklist.locator(':scope > li');
  await expect(gates).toHaveCount(4);
  const missingGates = gates.filter({ hasText: 'Missing:' });
  await expect(missingGates).toHaveCount(1);
  await expect(missingGates).toContainText('At least one after-repair photo per string');
  const missingItems = missingGates.getByRole('listitem');
  await expect(missingItems).toHaveCount(1);
  await expect(missingItems.getByText(`${second.label}: no after photo`, { exact: true })).toBeVisible();
  for (const done of [
    'Every string has an after-repair check that passes',
    'Every bypass-diode replacement record is complete',
    'Nothing is still waiting on the technician’s phone',
  ])
    await expect(gates.filter({ hasText: done })).toContainText(`Done:${done}`);
  await checklist.scrollIntoViewIfNeeded();
  await supervisor.screenshot({ path: screenshotPath('sign-off-checklist-missing-photo-1280') });

  // Return it to the technician with the reason.
  await supervisor.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Return to technician…' }).click();
  const dialog = supervisor.getByRole('dialog', { name: `Return to technician: ${number}` });
  await dialog.getByLabel('Reason').fill(`${second.label} has no after-repair photo; add one and resubmit.`);
  await dialog.getByRole('button', { name: 'Return to technician', exact: true }).click();
  await expect(dialog).toBeHidden();
  await expect(supervisor.getByText('Returned', { exact: true }).first()).toBeVisible();
  await expect(panel.getByRole('button', { name: `Sign off ${number}` })).toHaveCount(0);

  // ---- Technician (API): back in the field, the missing photo, resubmitted.
  expect((await currentTicket(technician, ticketId)).status).toBe('returned');
  await transition(technician, ticketId, 'in_field');
  await uploadPhoto(ticketId, second.id, 'after', `${second.label} after`);
  expect((await transition(technician, ticketId, 'awaiting_signoff')).status).toBe('awaiting_signoff');

  // ---- Supervisor signs off through the panel. A fresh browser: on a reload within 30 s the page
  // shows the ticket kept on the device (still "Returned", without the sign-off form; see report).
  await supervisor.context().close();
  const reviewer = await newPage(browser, baseURL, viewports.desktop);
  await signIn(reviewer, demoUsers.supervisor, undefined, `/work-orders/${ticketId}#sign-off`);
  const signOffPanel = reviewer.getByRole('region', { name: 'Sign-off' });
  await expect(reviewer.getByText('Awaiting sign-off', { exact: true }).first()).toBeVisible();
  await expect(signOffPanel.getByText('All evidence is in.')).toBeVisible();
  await expect(checklistOf(reviewer).getByText('Missing:')).toHaveCount(0);
  const comment = 'After photos of both strings in; both after checks pass at STC.';
  await signOffPanel.getByLabel('Comment').fill(comment);
  await signOffPanel.getByRole('button', { name: `Sign off ${number}` }).click();
  // Irreversible, so asked once; dismissing the question changes nothing.
  const confirm = reviewer.getByRole('dialog', { name: `Sign off ${number}?` });
  await expect(confirm).toContainText('cannot be reopened');
  await confirm.getByRole('button', { name: 'Cancel' }).click();
  await expect(confirm).toHaveCount(0);
  await expect(signOffPanel.getByRole('button', { name: `Sign off ${number}` })).toBeVisible();
  await signOffPanel.getByRole('button', { name: `Sign off ${number}` }).click();
  await reviewer.getByRole('dialog', { name: `Sign off ${number}?` }).getByRole('button', { name: 'Sign off', exact: true }).click();
  await expect(reviewer.getByText(`${number} signed off`, { exact: true })).toBeVisible();
  await expect(signOffPanel.getByText('Signed off by')).toBeVisible();
  await expect(reviewer.getByText('Signed off', { exact: true }).first()).toBeVisible();
  const { signOff } = await dispatcher.get<{ signOff: SignOff }>(`/api/work-orders/${ticketId}/sign-off`);
  expect(signOff.digest).toMatch(/^[0-9a-f]{64}$/);
  expect(signOff.comment).toBe(comment);
  const record = signOffPanel.getByRole('definition').filter({ hasText: signOff.digest });
  await expect(record).toHaveCount(1);
  await expect(signOffPanel.getByRole('definition').filter({ hasText: signOff.supervisor.name })).toHaveCount(1);
  await expect(signOffPanel.getByRole('definition').filter({ hasText: comment })).toHaveCount(1);

  await signOffPanel.getByRole('button', { name: 'Verify evidence' }).click();
  await expect(signOffPanel.getByText('Evidence unchanged since sign-off')).toBeVisible();
  await expect(signOffPanel.getByText('The evidence has changed since sign-off')).toHaveCount(0);
  await signOffPanel.scrollIntoViewIfNeeded();
  await reviewer.screenshot({ path: screenshotPath('sign-off-record-verified-1280') });
  await reviewer.context().close();

  // ---- The site's owner: Reports lists the ticket; the PDF downloads.
  const owner = await newPage(browser, baseURL, viewports.desktop);
  await signIn(owner, demoUsers.owner);
  await owner.getByRole('link', { name: 'Reports' }).filter({ visible: true }).first().click();
  await expect(owner.getByRole('heading', { level: 1, name: 'Close-out reports' })).toBeVisible();
  const site = owner.getByRole('region', { name: /^Fenwick Moor Solar FWM$/ });
  const card = site.getByRole('listitem').filter({ hasText: number });
  await expect(card).toHaveCount(1);
  await expect(card.getByRole('link', { name: `Sign-off of ${LABELS.join(', ')}`, exact: false })).toBeVisible();
  await expect(card).toContainText(LABELS.join(', '));
  await owner.screenshot({ path: screenshotPath('sign-off-owner-reports-1280'), fullPage: true });

  const downloading = owner.waitForEvent('download');
  await card.getByRole('link', { name: `Download PDF of ${number}` }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe(`${number}-close-out.pdf`);
  mkdirSync('tests/e2e/screenshots', { recursive: true });
  await download.saveAs(PDF_PATH);
  const pdf = readFileSync(PDF_PATH);
  expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(pdf.length).toBeGreaterThan(2_000);
  // The owner's copy is the signed report, not the PREVIEW draft.
  const viaRequest = await owner.request.get(`/api/work-orders/${ticketId}/report.pdf`);
  expect(viaRequest.ok()).toBe(true);
  expect(viaRequest.headers()['content-type']).toBe('application/pdf');
  expect((await viaRequest.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  if (existsSync('/usr/bin/pdftoppm')) {
    execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', PDF_PATH, 'tests/e2e/screenshots/close-out']);
    const rendered = ['close-out-1.png', 'close-out-01.png'].map((f) => `tests/e2e/screenshots/${f}`).find(existsSync);
    expect(rendered, 'pdftoppm rendered page 1').toBeTruthy();
  }
  if (existsSync('/usr/bin/pdftotext')) {
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', PDF_PATH, '-']).toString();
    expect(text).toContain(number);
    expect(text).toContain(signOff.digest.slice(0, 16));
    expect(text).not.toContain('PREVIEW');
  }
  await owner.context().close();
});
