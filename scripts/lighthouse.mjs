#!/usr/bin/env node
// Lighthouse (mobile form factor, default simulated throttling) on the pages a crew opens first: the
// sign-in page, the dispatcher's board and the technician's field page of a ticket in the field.
// Starts the browser-test server (fresh database, migrated and seeded, serving apps/web/dist), signs
// each role in through the API and hands Lighthouse the session cookie. Scores go to stdout and to
// .data/reports/lighthouse.txt; the exit code is 1 when a page is under performance 90 or
// accessibility 95.
//   node scripts/lighthouse.mjs          (TEST_SLOT, E2E_PORT, E2E_MAIL_PORT pick the server's slot)
// Uses Debian's chromium; never downloads a browser.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { computeMedianRun } from 'lighthouse/core/lib/median-run.js';
import { aptInstall, dataDir, ensureWebBuild, fail, isPortOpen, log, root, tsxBin } from './lib.mjs';

const targets = { performance: 90, accessibility: 95 };
const slot = process.env.TEST_SLOT ?? '9';
const port = Number(process.env.E2E_PORT ?? 8099);
const mailPort = Number(process.env.E2E_MAIL_PORT ?? 1059);
const baseUrl = `http://127.0.0.1:${port}`;
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const chromeFlags = ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const password = 'stringfield-demo';
const reportFile = path.join(dataDir, 'reports/lighthouse.txt');
// Lighthouse's own advice for its variance: several runs, and the median one (by its first contentful
// paint and time to interactive) as the figure. LIGHTHOUSE_PAGES=board,field-page narrows the pages.
const runs = Math.max(1, Number(process.env.LIGHTHOUSE_RUNS ?? 3));
const onlyPages = process.env.LIGHTHOUSE_PAGES?.split(',').filter(Boolean) ?? null;
// The full reports, for the why behind a score (open in https://googlechrome.github.io/lighthouse/viewer/).
const jsonDir = path.join(dataDir, 'reports/lighthouse');

// ---------- the server ----------

async function startServer() {
  if (await isPortOpen(port)) fail(`Port ${port} is taken; set E2E_PORT (and TEST_SLOT, E2E_MAIL_PORT) to a free slot.`);
  const child = spawn(tsxBin, ['tests/e2e/server.ts'], {
    cwd: root,
    env: { ...process.env, TEST_SLOT: slot, E2E_PORT: String(port), E2E_MAIL_PORT: String(mailPort) },
    stdio: ['ignore', 'ignore', 'inherit'],
    detached: true,
  });
  const stop = () => {
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      // already gone
    }
  };
  process.on('exit', stop);
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => process.exit(130));
  const deadline = Date.now() + 120_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) fail(`The test server exited with ${child.exitCode}`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return stop;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  stop();
  fail('The test server did not answer /api/health within 120 s');
}

// ---------- API sessions ----------

/** A signed-in API session: the cookie header to hand to Lighthouse, plus JSON helpers. */
async function signIn(email) {
  const jar = new Map();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const keep = (response) => {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair.indexOf('=');
      jar.set(pair.slice(0, at).trim(), pair.slice(at + 1).trim());
    }
  };
  const call = async (method, url, body, token) => {
    const response = await fetch(`${baseUrl}${url}`, {
      method,
      headers: { cookie: cookie(), ...(body ? { 'content-type': 'application/json' } : {}), ...(token ? { 'x-csrf-token': token } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    keep(response);
    const text = await response.text();
    if (!response.ok) throw new Error(`${method} ${url} answered ${response.status}: ${text}`);
    return text ? JSON.parse(text) : {};
  };
  const csrf = async () => (await call('GET', '/api/auth/csrf')).csrfToken;
  await call('POST', '/api/auth/login', { email, password }, await csrf());
  // The session id changes at sign-in; the token of the new session is needed from here on.
  const token = await csrf();
  return {
    cookie,
    get: (url) => call('GET', url),
    post: (url, body) => call('POST', url, body, token),
  };
}

/** A ticket on two FWM strings, dispatched to the demo technician and started: the field page has work. */
async function ticketInTheField(dispatcher, technician) {
  const sites = await dispatcher.get('/api/sites?q=FWM&pageSize=50');
  const site = sites.items.find((s) => s.code === 'FWM');
  const stringIds = [];
  for (const label of ['INV15-MPPT1-S1', 'INV15-MPPT1-S2']) {
    const { items } = await dispatcher.get(`/api/sites/${site.id}/strings?q=${encodeURIComponent(label)}&pageSize=50`);
    stringIds.push(items.find((s) => s.label === label).id);
  }
  const { items: techs } = await dispatcher.get('/api/technicians');
  const assigneeId = techs.find((t) => t.name === 'Demo Technician').id;
  const { items } = await dispatcher.post('/api/work-orders', {
    siteId: site.id,
    strings: stringIds.map((stringId) => ({ stringId, symptom: 'Voc low against its neighbours' })),
    mode: 'single',
    faultCategory: 'low_voltage',
    priority: 'P2',
    title: 'Low Voc on INV15 input 1 (Lighthouse run)',
    description: 'Opened by scripts/lighthouse.mjs.',
    source: 'monitoring_alert',
    assigneeId,
  });
  let ticket = items[0];
  if (ticket.status !== 'dispatched') {
    ticket = await dispatcher.post(`/api/work-orders/${ticket.id}/transitions`, { to: 'dispatched', version: ticket.version, assigneeId });
  }
  return technician.post(`/api/work-orders/${ticket.id}/transitions`, { to: 'in_field', version: ticket.version });
}

// ---------- Lighthouse ----------

async function audit(chrome, url, cookie) {
  const result = await lighthouse(url, {
    port: chrome.port,
    output: 'json',
    logLevel: 'error',
    onlyCategories: ['performance', 'accessibility'],
    formFactor: 'mobile',
    screenEmulation: { mobile: true, width: 412, height: 823, deviceScaleFactor: 1.75, disabled: false },
    ...(cookie ? { extraHeaders: { Cookie: cookie } } : {}),
  });
  if (!result) throw new Error(`Lighthouse gave no result for ${url}`);
  return result.lhr;
}

/** The figures of one run, and what it did not pass. */
function summarize(lhr) {
  const score = (category) => Math.round((lhr.categories[category]?.score ?? 0) * 100);
  const metric = (id) => lhr.audits[id]?.displayValue ?? '–';
  const failing = (category) =>
    lhr.categories[category].auditRefs
      .map((ref) => lhr.audits[ref.id])
      .filter((a) => a && a.score !== null && a.score < 1 && a.scoreDisplayMode !== 'informative' && a.scoreDisplayMode !== 'notApplicable' && a.scoreDisplayMode !== 'manual')
      .map((a) => `${a.id}${a.displayValue ? ` (${a.displayValue})` : ''}`);
  return {
    finalUrl: lhr.finalDisplayedUrl,
    performance: score('performance'),
    accessibility: score('accessibility'),
    metrics: ['first-contentful-paint', 'largest-contentful-paint', 'total-blocking-time', 'cumulative-layout-shift', 'speed-index'].map(
      (id) => `${id.replace(/-/g, ' ')} ${metric(id)}`,
    ),
    failing: [...failing('performance'), ...failing('accessibility')],
    errors: lhr.runtimeError ? [lhr.runtimeError.message] : [],
    benchmarkIndex: lhr.environment?.benchmarkIndex,
  };
}

if (!process.env.CHROME_PATH && !fs.existsSync(chromePath)) aptInstall(['chromium'], 'Chromium (for Lighthouse)');
ensureWebBuild();
log(`Starting the test server on ${baseUrl} (slot ${slot})…`);
const stopServer = await startServer();
const dispatcher = await signIn('dispatcher@stringfield.test');
const technician = await signIn('tech@stringfield.test');
const ticket = await ticketInTheField(dispatcher, technician);

const pages = [
  { name: 'Sign-in', key: 'sign-in', path: '/sign-in', cookie: null },
  { name: 'Board (dispatcher)', key: 'board', path: '/work-orders', cookie: dispatcher.cookie() },
  { name: 'Field page (technician)', key: 'field-page', path: `/work-orders/${ticket.id}/field`, cookie: technician.cookie() },
];

const chrome = await chromeLauncher.launch({ chromePath, chromeFlags });
const lines = [`Lighthouse ${new Date().toISOString()} · mobile, simulated throttling · ${runs} run(s) a page, median shown · targets: performance ≥ ${targets.performance}, accessibility ≥ ${targets.accessibility}`];
let isBelowTarget = false;
try {
  for (const page of pages) {
    if (onlyPages && !onlyPages.includes(page.key)) continue;
    const lhrs = [];
    for (let i = 0; i < runs; i += 1) {
      let lhr = await audit(chrome, `${baseUrl}${page.path}`, page.cookie);
      // A trace that failed to record (NO_NAVSTART and the like) says nothing about the page: once more.
      if (lhr.runtimeError) lhr = await audit(chrome, `${baseUrl}${page.path}`, page.cookie);
      lhrs.push(lhr);
    }
    const valid = lhrs.filter((lhr) => !lhr.runtimeError);
    const median = valid.length > 0 ? computeMedianRun(valid) : lhrs[0];
    fs.mkdirSync(jsonDir, { recursive: true });
    fs.writeFileSync(path.join(jsonDir, `${page.key}.json`), JSON.stringify(median));
    const r = summarize(median);
    const scores = lhrs.map((lhr) => summarize(lhr).performance);
    const isOk = r.performance >= targets.performance && r.accessibility >= targets.accessibility && r.errors.length === 0;
    if (!isOk) isBelowTarget = true;
    lines.push(
      `${isOk ? 'ok  ' : 'LOW '} ${page.name.padEnd(26)} performance ${String(r.performance).padStart(3)}  accessibility ${String(r.accessibility).padStart(3)}  ${page.path}`,
      `     ${r.metrics.join(' · ')} · benchmark index ${Math.round(r.benchmarkIndex ?? 0)}`,
    );
    if (runs > 1) lines.push(`     median of ${runs} runs; performance in each run: ${scores.join(', ')}`);
    if (r.finalUrl !== `${baseUrl}${page.path}`) lines.push(`     ended at ${r.finalUrl}`);
    if (r.failing.length > 0) lines.push(`     not passed: ${r.failing.join(', ')}`);
    for (const e of r.errors) lines.push(`     error: ${e}`);
  }
} finally {
  await chrome.kill();
  stopServer();
}

const text = lines.join('\n') + '\n';
fs.mkdirSync(path.dirname(reportFile), { recursive: true });
fs.writeFileSync(reportFile, text);
process.stdout.write(text);
log(`Written to ${path.relative(root, reportFile)}`);
process.exit(isBelowTarget ? 1 : 0);
