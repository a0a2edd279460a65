import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import sharp from 'sharp';
import { createApp } from '../../apps/api/src/app.ts';

// The API serves the built web app; on a phone over a mobile network its scripts must travel compressed.
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'stringfield-dist-'));
fs.mkdirSync(path.join(dist, 'assets'));
fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Stringfield</title><div id="root"></div>');
const script = `export const rows = [${Array.from({ length: 2000 }, (_, i) => `{ label: 'INV01-MPPT1-S${i}' }`).join(',')}];\n`;
fs.writeFileSync(path.join(dist, 'assets/index-abc123.js'), script);
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
});
