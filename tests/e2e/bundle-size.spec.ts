import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import zlib from 'node:zlib';
import { expect, test } from '@playwright/test';

// Issue 10: the technician's phone must get its first field page from under 200 KB of gzipped
// script and style, whatever else the app grows. Counted from the built app (Vite's manifest): the
// entry chunk with its static imports and CSS, the app start-up the entry always imports next
// (src/app/start.tsx: React's renderer, the providers, the router), the field page's route chunk, and
// the check queue sync that every signed-in page of a technician loads at once (lazy since the staged
// start-up, src/app/routes/field-sync.tsx), each with its own static imports. Chunks loaded later on
// demand (a string's check form, charts, other pages) are not counted.

const LIMIT_KB = 200;
// WEB_DIST: the build the e2e server serves, when it is not apps/web/dist (as for the API).
const dist = process.env.WEB_DIST ?? path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../apps/web/dist');
const fieldRoute = 'src/app/routes/field-checks.tsx';
const appStart = 'src/app/start.tsx';
const checkQueueSync = 'src/features/field-checks/components/check-queue-sync.tsx';
// Downloaded and mounted once the first page has settled; still counted, as every page has it a second later.
const toaster = 'src/components/ui/app-toaster.tsx';

type ManifestChunk = { file: string; isEntry?: boolean; imports?: string[]; css?: string[] };
type Manifest = Record<string, ManifestChunk>;

function staticClosure(manifest: Manifest, key: string, seen = new Set<string>()): Set<string> {
  if (seen.has(key)) return seen;
  const chunk = manifest[key];
  if (!chunk) throw new Error(`${key} is not in the Vite manifest`);
  seen.add(key);
  for (const imported of chunk.imports ?? []) staticClosure(manifest, imported, seen);
  return seen;
}

function filesOf(manifest: Manifest, keys: Iterable<string>): string[] {
  const files = new Set<string>();
  for (const key of keys) {
    const chunk = manifest[key]!;
    files.add(chunk.file);
    for (const css of chunk.css ?? []) files.add(css);
  }
  return [...files];
}

const readManifest = () => JSON.parse(fs.readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8')) as Manifest;

/** The script files a first page of `route` loads before it can draw: the entry, the app's start-up and the route, each with its static imports. */
function firstLoadScripts(manifest: Manifest, route: string): string[] {
  const entry = Object.keys(manifest).find((key) => manifest[key]!.isEntry)!;
  return filesOf(
    manifest,
    new Set([...staticClosure(manifest, entry), ...staticClosure(manifest, appStart), ...staticClosure(manifest, route)]),
  ).filter((file) => file.endsWith('.js'));
}

const gzipBytes = (file: string) => zlib.gzipSync(fs.readFileSync(path.join(dist, file)), { level: 9 }).length;
const kb = (bytes: number) => Math.round((bytes / 1024) * 10) / 10;

test('the technician’s first field page needs under 200 KB of gzipped JS and CSS', () => {
  const manifestFile = path.join(dist, '.vite/manifest.json');
  expect(fs.existsSync(manifestFile), `${manifestFile}: build the web app first (npm run build -w apps/web)`).toBe(true);
  const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Manifest;
  const entry = Object.keys(manifest).find((key) => manifest[key]!.isEntry);
  expect(entry, 'an entry chunk in the manifest').toBeDefined();

  const entryFiles = filesOf(manifest, staticClosure(manifest, entry!));
  const fieldFiles = filesOf(
    manifest,
    new Set([
      ...staticClosure(manifest, entry!),
      ...staticClosure(manifest, appStart),
      ...staticClosure(manifest, fieldRoute),
      ...staticClosure(manifest, checkQueueSync),
      ...staticClosure(manifest, toaster),
    ]),
  );
  const sizes = fieldFiles.map((file) => ({ file, gzipBytes: gzipBytes(file) })).sort((a, b) => b.gzipBytes - a.gzipBytes);
  const entryBytes = sizes.filter((s) => entryFiles.includes(s.file)).reduce((sum, s) => sum + s.gzipBytes, 0);
  const totalBytes = sizes.reduce((sum, s) => sum + s.gzipBytes, 0);

  console.log(
    [
      `Technician's first field page: ${kb(totalBytes)} KB gzipped (limit ${LIMIT_KB} KB); the entry and its static imports alone: ${kb(entryBytes)} KB`,
      ...sizes.map((s) => `  ${String(kb(s.gzipBytes)).padStart(6)} KB  ${s.file}`),
    ].join('\n'),
  );
  expect(kb(totalBytes), 'gzipped KB of JS and CSS before the field page can render').toBeLessThan(LIMIT_KB);
});

// The board and the field page show records; neither must download and build the forms' input schemas
// (a check and a message for every field), which cost a phone tens of milliseconds of start-up for nothing
// on these pages. Each marker is one message of such a schema; the pages with the form still have it.
const formSchemaMarkers = [
  // packages/shared/src/assets.ts: the asset registry's forms (the records are in asset-records.ts)
  'Start voltage must be inside the MPPT window',
  'The highest ambient must be above the lowest',
  // field-check-inputs.ts: the check form (the checks as listed are in field-checks.ts)
  'Say how the irradiance was measured',
  'Enter the calibration due date, like 2027-03-31',
  // work-order-inputs.ts: the new-ticket, edit and comment forms (the tickets are in work-orders.ts)
  'Pick at least one string',
  // auth-inputs.ts: the sign-in, reset and people forms (who is signed in is in auth.ts)
  'Enter a valid e-mail address, like name@example.com',
];
for (const [page, route] of [
  ['board', 'src/app/routes/work-orders.tsx'],
  ['field page', fieldRoute],
] as const) {
  test(`the ${page}’s code holds none of the forms’ input schemas`, () => {
    const manifest = readManifest();
    const pageFiles = firstLoadScripts(manifest, route);
    const read = (file: string) => fs.readFileSync(path.join(dist, file), 'utf8');
    const allFiles = Object.values(manifest).map((chunk) => chunk.file).filter((file) => file.endsWith('.js'));
    for (const marker of formSchemaMarkers) {
      expect(allFiles.some((file) => read(file).includes(marker)), `some chunk of the app holds "${marker}"`).toBe(true);
      expect(pageFiles.filter((file) => read(file).includes(marker)), `${page} chunks holding "${marker}"`).toEqual([]);
    }
  });
}

// Over HTTP/1.1 a phone fetches six files at a time from one server, and each file costs at least a round
// trip on a mobile network however small it is. The first pages' code used to arrive in 19 (field page)
// to 26 (board) files, a dozen of them under a kilobyte (one API call's module, a key list, a badge); the
// build now groups the tickets' common modules and the app's start-up modules (vite.config.ts).
const MAX_FIRST_PAGE_SCRIPTS = 12;
for (const [page, route] of [
  ['board', 'src/app/routes/work-orders.tsx'],
  ['field page', fieldRoute],
  ['home page', 'src/app/routes/home.tsx'],
] as const) {
  test(`the ${page}’s first load needs at most ${MAX_FIRST_PAGE_SCRIPTS} script files`, () => {
    const scripts = firstLoadScripts(readManifest(), route);
    console.log(`${page}: ${scripts.length} script files: ${scripts.join(', ')}`);
    expect(scripts.length, `script files of the ${page}'s first load`).toBeLessThanOrEqual(MAX_FIRST_PAGE_SCRIPTS);
  });
}

// main.tsx starts the app in short tasks, one piece built in each (see there). That holds only while the
// entry script imports nothing itself: a static import would be built with the entry, in its task.
test('the entry script imports no other file: React and zod are built in start-up tasks of their own', () => {
  const manifest = readManifest();
  const entry = Object.keys(manifest).find((key) => manifest[key]!.isEntry)!;
  expect(manifest[entry]!.imports ?? [], 'static imports of the entry').toEqual([]);
});
