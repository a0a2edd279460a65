#!/usr/bin/env node
// npm run audit:deps — the production dependency audit: `npm audit --omit=dev`, failing on any high or
// critical advisory that is not listed, with its reason, in scripts/audit-exceptions.json.
// Exit codes: 0 clean (or every finding excepted), 1 findings, 2 no verdict (the registry did not answer;
// this machine's registry answers the audit endpoint with HTTP 405).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { log, root } from './lib.mjs';

const exceptions = JSON.parse(fs.readFileSync(path.join(root, 'scripts/audit-exceptions.json'), 'utf8')).exceptions;
const run = spawnSync('npm', ['audit', '--omit=dev', '--json'], { cwd: root, encoding: 'utf8' });
let report;
try {
  report = JSON.parse(run.stdout);
} catch {
  report = null;
}
if (!report || report.error || !report.vulnerabilities) {
  const why = report?.message ?? report?.error?.summary ?? 'no JSON report';
  log(`No audit verdict: the registry did not answer (${why.trim()}). Run this where the npm registry's audit endpoint is reachable.`);
  process.exit(2);
}
const serious = Object.values(report.vulnerabilities).filter((v) => v.severity === 'high' || v.severity === 'critical');
const open = serious.filter((v) => !exceptions.some((e) => e.package === v.name));
for (const v of serious) {
  const e = exceptions.find((x) => x.package === v.name);
  log(`${v.severity.padEnd(8)} ${v.name} ${v.range}${e ? ` — excepted: ${e.reason}` : ''}`);
}
const counts = report.metadata?.vulnerabilities ?? {};
log(`Production dependencies: ${counts.critical ?? 0} critical, ${counts.high ?? 0} high, ${counts.moderate ?? 0} moderate, ${counts.low ?? 0} low; ${open.length} high/critical not excepted.`);
process.exit(open.length ? 1 : 0);
