import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { createApp } from '../../apps/api/src/app.ts';

// The API serves the built web app; on a phone over a mobile network its scripts must travel compressed.
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'stringfield-dist-'));
fs.mkdirSync(path.join(dist, 'assets'));
const indexHtml = '<!doctype html><html><head><title>Stringfield</title><script type="module" src="/assets/index-abc123.js"></script></head><body><div id="root"></div></body></html>';
fs.writeFileSync(path.join(dist, 'index.html'), indexHtml);
const script = `export const rows = [${Array.from({ length: 2000 }, (_, i) => `{ label: 'INV01-MPPT1-S${i}' }`).join(',')}];\n`;
fs.writeFileSync(path.join(dist, 'assets/index-abc123.js'), script);
const brotli = zlib.brotliCompressSync(script);
fs.writeFileSync(path.join(dist, 'assets/index-abc123.js.br'), brotli); // as the web build writes it
fs.writeFileSync(
  path.join(dist, 'first-pages.json'),
  JSON.stringify([{ pattern: '^\\/work-orders\\/?$', files: ['assets/work-orders-def456.js', 'assets/index-abc123.js'] }]),
);
afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

describe('the built web app', () => {
  const app = createApp({ webDist: dist });

  it('sends scripts gzip-compressed, cached for good (hashed names)', async () => {
    const res = await supertest(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.text).toBe(script); // supertest unzips
  });

  it('answers every app path with index.html, never cached', async () => {
    const res = await supertest(app).get('/work-orders/12').expect(200);
    expect(res.text).toContain('<div id="root">');
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('leaves images as they are (already compressed)', async () => {
    const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#3a7' } }).jpeg().toBuffer();
    fs.writeFileSync(path.join(dist, 'assets/photo.jpg'), jpeg);
    const res = await supertest(app).get('/assets/photo.jpg').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(Number(res.headers['content-length'])).toBe(jpeg.length);
  });

  it('sends the build’s brotli copy of a script to a browser that takes brotli, and gzip to one that does not', async () => {
    const res = await supertest(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip, deflate, br').expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    // The build's file as it is, not compressed again on the fly (that would be sent chunked, without a length).
    expect(Number(res.headers['content-length'])).toBe(brotli.length);
    expect(res.headers['content-type']).toMatch(/^text\/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
    expect(res.text).toBe(script); // supertest decodes brotli too
    const gzip = await supertest(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip').expect(200);
    expect(gzip.headers['content-encoding']).toBe('gzip');
    const refused = await supertest(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip, br;q=0').expect(200);
    expect(refused.headers['content-encoding']).toBe('gzip');
    // A byte range of the compressed copy would mean nothing to the browser: the whole file, compressed.
    const ranged = await supertest(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'br').set('Range', 'bytes=999999-').expect(200);
    expect(ranged.headers['content-encoding']).toBe('br');
    expect(ranged.text).toBe(script);
  });

  it('sends the plain file, not a brotli copy older than it', async () => {
    const stale = path.join(dist, 'assets/stale-abc123.js');
    fs.writeFileSync(stale, script);
    fs.writeFileSync(`${stale}.br`, zlib.brotliCompressSync('export const old = true;\n'));
    const before = new Date(Date.now() - 60_000);
    fs.utimesSync(`${stale}.br`, before, before);
    const res = await supertest(app).get('/assets/stale-abc123.js').set('Accept-Encoding', 'gzip, br').expect(200);
    expect(res.text).toBe(script);
  });

  it('lists a first page’s scripts and the session lookup as preloads in its HTML, and only the session lookup elsewhere', async () => {
    const board = await supertest(app).get('/work-orders').expect(200);
    expect(board.headers['content-type']).toMatch(/^text\/html/);
    expect(board.text).toContain('<link rel="modulepreload" crossorigin fetchpriority="low" href="/assets/work-orders-def456.js">');
    expect(board.text).toContain('<link rel="preload" as="fetch" crossorigin href="/api/auth/me">');
    // Already in the HTML as the entry script: not listed twice.
    expect(board.text.split('href="/assets/index-abc123.js"')).toHaveLength(1);
    expect(board.text.split('src="/assets/index-abc123.js"')).toHaveLength(2);
    const other = await supertest(app).get('/sites/3').expect(200);
    expect(other.text).toBe(indexHtml.replace('</head>', '<link rel="preload" as="fetch" crossorigin href="/api/auth/me"></head>'));
  });

  it('serves a rebuilt index.html without a restart', async () => {
    const rebuilt = indexHtml.replace('<title>Stringfield</title>', '<title>Stringfield (rebuilt)</title>');
    fs.writeFileSync(path.join(dist, 'index.html'), rebuilt);
    const later = new Date(Date.now() + 5_000);
    fs.utimesSync(path.join(dist, 'index.html'), later, later);
    expect((await supertest(app).get('/sites/3').expect(200)).text).toContain('<title>Stringfield (rebuilt)</title>');
    fs.writeFileSync(path.join(dist, 'index.html'), indexHtml);
  });
});
