import fs from 'node:fs';
import path from 'node:path';
import type { RequestHandler } from 'express';

/**
 * dist/first-pages.json, written by the web build: for each page a crew opens first (a bookmark, a link in
 * a message), its address pattern and the script files its route needs.
 */
type FirstPage = { pattern: string; files: string[] };

/** Built assets carry their content's hash in their name: a browser may keep them for good. */
export const IMMUTABLE_ASSET = 'public, max-age=31536000, immutable';

type Shell = { mtimeMs: number; other: string; pages: Array<{ pattern: RegExp; html: string }> };

/**
 * The web app's HTML for an address, with the session lookup as a preload. For a first page it also lists
 * that page's scripts as preloads, so a phone fetches them with the app's own script instead of a round
 * trip after it has run. Read again whenever the build changes it.
 */
export function webShell(webDist: string): RequestHandler {
  const indexFile = path.join(webDist, 'index.html');
  const firstPagesFile = path.join(webDist, 'first-pages.json');
  let shell: Shell | null = null;
  const load = (): Shell => {
    // Both files: a request in the middle of a build must not keep a half-written list.
    const mtimeMs = fs.statSync(indexFile).mtimeMs + (fs.existsSync(firstPagesFile) ? fs.statSync(firstPagesFile).mtimeMs : 0);
    if (shell?.mtimeMs === mtimeMs) return shell;
    const plain = fs.readFileSync(indexFile, 'utf8');
    let firstPages: FirstPage[] = [];
    try {
      firstPages = JSON.parse(fs.readFileSync(firstPagesFile, 'utf8')) as FirstPage[];
    } catch {
      // An older or hand-made build: every address gets the plain HTML.
    }
    // Low priority: the browser fetches the page's code early but after what paints the frame (the styles,
    // the fonts, the app's own start-up code), which a phone's first paint waits on.
    const withPreloads = (files: string[]) => {
      const links = files
        .filter((file) => /^assets\/[\w.-]+\.js$/.test(file) && !plain.includes(`/${file}"`))
        .map((file) => `<link rel="modulepreload" crossorigin fetchpriority="low" href="/${file}">`);
      // The app asks who is signed in before anything else, on every page, but only once its start-up code
      // has run (main.tsx); same URL, mode and credentials as its fetch, so the answer is on its way meanwhile.
      links.push('<link rel="preload" as="fetch" crossorigin href="/api/auth/me">');
      return plain.replace('</head>', `${links.join('')}</head>`);
    };
    shell = {
      mtimeMs,
      other: firstPages.length > 0 ? withPreloads([]) : plain,
      pages: firstPages.map((p) => ({ pattern: new RegExp(p.pattern), html: withPreloads(p.files) })),
    };
    return shell;
  };
  return (req, res) => {
    const { other, pages } = load();
    res.setHeader('Cache-Control', 'no-cache');
    res.type('html').send(pages.find((p) => p.pattern.test(req.path))?.html ?? other);
  };
}

const precompressedTypes: Record<string, string> = { '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8' };

/**
 * Scripts and styles brotli-compressed by the build (a `.br` beside each): sent as they are to a browser
 * that takes brotli — smaller than gzip and no compression work per request. Anything else, or a `.br`
 * older than its file, goes on to the plain file (compressed on the fly as before).
 */
export function precompressedAssets(webDist: string): RequestHandler {
  const assets = path.join(webDist, 'assets');
  return (req, res, next) => {
    const type = precompressedTypes[path.extname(req.path)];
    if (!type || (req.method !== 'GET' && req.method !== 'HEAD') || req.acceptsEncodings('br', 'identity') !== 'br') return next();
    const name = path.basename(req.path);
    if (`/assets/${name}` !== req.path) return next();
    const file = path.join(assets, name);
    let current = false;
    try {
      current = fs.statSync(`${file}.br`).mtimeMs >= fs.statSync(file).mtimeMs;
    } catch {
      // no plain file or no brotli copy
    }
    if (!current) return next();
    const headers = {
      'Content-Type': type,
      'Content-Encoding': 'br',
      Vary: 'Accept-Encoding',
      'Cache-Control': IMMUTABLE_ASSET,
    };
    res.set(headers);
    // Whole files only: a byte range of the compressed copy means nothing to the browser.
    res.sendFile(`${file}.br`, { acceptRanges: false }, (err) => {
      if (!err || res.headersSent) return;
      // Not sent after all (unreadable, gone in a deploy): the plain file goes out without these headers.
      for (const header of Object.keys(headers)) res.removeHeader(header);
      next();
    });
  };
}
