#!/usr/bin/env node
// npm test: the same set-up as npm start (dependencies, MariaDB, browser), then every check:
// typecheck, lint, unit tests, API tests against real MariaDB, and browser end-to-end tests in Debian's
// chromium. Ends with one line "N passed, N failed".
//   node scripts/test.mjs [--only typecheck|lint|unit|api|e2e]
import fs from 'node:fs';
import path from 'node:path';
import { aptInstall, ensureNodeModules, ensureWebBuild, log, root, run, runAsync, which } from './lib.mjs';

const onlyIdx = process.argv.indexOf('--only');
const only = onlyIdx >= 0 ? process.argv[onlyIdx + 1] : null;
const wants = (step) => !only || only === step;

ensureNodeModules();
if (wants('e2e') && !fs.existsSync('/usr/bin/chromium')) aptInstall(['chromium'], 'Chromium (for the browser tests)');
if (wants('api') || wants('e2e')) {
  run(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start', '--databases', 'stringfield_test,stringfield_e2e']);
}

const reports = path.join(root, '.data/reports');
fs.mkdirSync(reports, { recursive: true });
const bin = (name) => path.join(root, 'node_modules/.bin', name);
const env = { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1', FORCE_COLOR: process.env.CI ? '0' : '1' };

const results = [];
function readJson(file) {
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
}

async function check(name, cmd, args) {
  log(`── ${name} ──`);
  const code = await runAsync(cmd, args, { env });
  results.push({ name, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1, code });
}

async function vitest(name, project) {
  log(`── ${name} tests ──`);
  const out = path.join(reports, `${project}.json`);
  fs.rmSync(out, { force: true });
  const code = await runAsync(bin('vitest'), ['run', '--project', project, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`], { env });
  const r = readJson(out);
  const passed = r?.numPassedTests ?? 0;
  const failed = (r?.numFailedTests ?? 0) + (code !== 0 && !(r?.numFailedTests > 0) ? 1 : 0);
  results.push({ name, passed, failed, code });
}

async function playwright() {
  log('── browser end-to-end tests ──');
  ensureWebBuild();
  const out = path.join(reports, 'e2e.json');
  fs.rmSync(out, { force: true });
  const code = await runAsync(bin('playwright'), ['test', '--reporter=list,json'], {
    env: { ...env, PLAYWRIGHT_JSON_OUTPUT_NAME: out },
  });
  const r = readJson(out);
  const passed = (r?.stats?.expected ?? 0) + (r?.stats?.flaky ?? 0);
  const failed = (r?.stats?.unexpected ?? 0) + (code !== 0 && !(r?.stats?.unexpected > 0) ? 1 : 0);
  results.push({ name: 'e2e', passed, failed, code });
}

if (wants('typecheck')) await check('typecheck', 'npm', ['run', '--silent', 'typecheck']);
if (wants('lint')) await check('lint', bin('eslint'), ['.', '--max-warnings=0']);
if (wants('unit')) await vitest('unit', 'unit');
if (wants('api')) await vitest('API', 'api');
if (wants('e2e')) {
  if (!which('chromium') && !fs.existsSync('/usr/bin/chromium')) results.push({ name: 'e2e', passed: 0, failed: 1 });
  else await playwright();
}

const passed = results.reduce((n, r) => n + r.passed, 0);
const failed = results.reduce((n, r) => n + r.failed, 0);
log('');
for (const r of results) log(`${r.failed ? '✗' : '✓'} ${r.name.padEnd(10)} ${r.passed} passed, ${r.failed} failed`);
process.stdout.write(`${passed} passed, ${failed} failed\n`);
process.exit(failed === 0 && passed > 0 ? 0 : 1);
