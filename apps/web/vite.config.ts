import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { fileURLToPath, URL } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig, type Plugin } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';
import { coreFonts } from './plugins/core-fonts.ts';

// The API runs on 8080 in development; the browser only ever talks to its own origin, so
// cookies stay first-party and the API's CSP (`script-src 'self'`) holds for the built app.
const apiTarget = process.env.STRINGFIELD_API_URL ?? 'http://127.0.0.1:8080';

// The installed app's colours come from the design tokens, so the splash screen matches the header.
const tokens = readFileSync(fileURLToPath(new URL('./src/styles.css', import.meta.url)), 'utf8');
const token = (name: string, fallback: string) => new RegExp(`--color-${name}:\\s*(#[0-9a-fA-F]{6})`).exec(tokens)?.[1] ?? fallback;

/**
 * main.tsx starts the app in steps through dynamic imports (see there). Vite preloads only the
 * entry's static imports from index.html; this adds `modulepreload` links for the chunks the entry
 * imports dynamically on every start (src/app/start.tsx and what it needs), so they download in
 * parallel with the entry instead of after it has run.
 */
function preloadStartChunks(entries: RegExp): Plugin {
  return {
    name: 'stringfield:preload-start-chunks',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, ctx) {
        if (!ctx.bundle) return html;
        const chunks = new Map<string, { imports: string[]; facadeModuleId: string | null }>();
        for (const output of Object.values(ctx.bundle)) if (output.type === 'chunk') chunks.set(output.fileName, output);
        const files = new Set<string>();
        const add = (file: string) => {
          if (files.has(file)) return;
          files.add(file);
          for (const dep of chunks.get(file)?.imports ?? []) add(dep);
        };
        for (const [file, chunk] of chunks) if (chunk.facadeModuleId && entries.test(chunk.facadeModuleId)) add(file);
        return [...files]
          .filter((file) => !html.includes(`/${file}"`))
          .map((file) => ({
            tag: 'link',
            attrs: { rel: 'modulepreload', crossorigin: true, href: `/${file}` },
            injectTo: 'head' as const,
          }));
      },
    },
  };
}

/**
 * `preload` links for the core faces every page sets its text in (plugins/core-fonts.ts), so that they download beside the
 * stylesheet instead of after the browser has read it and laid out the first text.
 */
function preloadFonts(files: RegExp): Plugin {
  return {
    name: 'stringfield:preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const fonts = Object.values(ctx.bundle ?? {}).filter((o) => o.type === 'asset' && files.test(o.fileName));
        if (ctx.bundle && fonts.length === 0) throw new Error(`no font file matches ${files}`);
        return fonts.map((font) => ({
          tag: 'link',
          attrs: { rel: 'preload', as: 'font', type: 'font/woff2', crossorigin: true, href: `/${font.fileName}` },
          injectTo: 'head' as const,
        }));
      },
    },
  };
}

/**
 * dist/first-pages.json for the API: each first page of src/app/first-page.ts (its address pattern, read
 * from that file) with the script files its route needs, so the HTML served for that address can list
 * them as preloads (apps/api/src/lib/web-shell.ts).
 */
function firstPagesManifest(): Plugin {
  const source = fileURLToPath(new URL('./src/app/first-page.ts', import.meta.url));
  return {
    name: 'stringfield:first-pages',
    apply: 'build',
    generateBundle(_options, bundle) {
      const text = readFileSync(source, 'utf8');
      const pages = [...text.matchAll(/\[\/(.+?)\/,\s*\(\) => import\('\.\/(routes\/[\w-]+)'\)\]/g)].map(([, pattern, route]) => ({ pattern: pattern!, route: route! }));
      // Every page listed there must be read here, or one would silently go without its preloads.
      const listed = text.match(/import\('\.\/routes\//g)?.length ?? 0;
      if (pages.length === 0 || pages.length !== listed) this.error(`read ${pages.length} of the ${listed} first pages in ${source}; keep each as [/pattern/, () => import('./routes/…')]`);
      const chunks = Object.values(bundle).filter((o) => o.type === 'chunk');
      const byFile = new Map(chunks.map((c) => [c.fileName, c]));
      const closure = (file: string, seen: Set<string>) => {
        if (seen.has(file)) return seen;
        seen.add(file);
        for (const dep of byFile.get(file)?.imports ?? []) closure(dep, seen);
        return seen;
      };
      const out = pages.map(({ pattern, route }) => {
        const chunk = chunks.find((c) => c.facadeModuleId?.replaceAll('\\', '/').endsWith(`/src/app/${route}.tsx`));
        if (!chunk) this.error(`no chunk for ${route}`);
        return { pattern, files: [...closure(chunk.fileName, new Set<string>())] };
      });
      this.emitFile({ type: 'asset', fileName: 'first-pages.json', source: JSON.stringify(out, null, 1) });
    },
  };
}

/**
 * A brotli copy (.br) beside every script and style, made once at build time at the highest quality;
 * the API sends it to browsers that take brotli (about 12 % fewer bytes than gzip for our scripts).
 */
function brotliCopies(): Plugin {
  let outDir = 'dist';
  return {
    name: 'stringfield:brotli-copies',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    writeBundle() {
      const assets = path.join(outDir, 'assets');
      for (const name of readdirSync(assets)) {
        if (!/\.(js|css)$/.test(name)) continue;
        const file = path.join(assets, name);
        writeFileSync(`${file}.br`, zlib.brotliCompressSync(readFileSync(file), { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11 } }));
      }
    },
  };
}

// Not the toaster (Sonner, loaded after the first page) nor the table (TanStack Table, table pages only).
// Also the small modules app/start.tsx needs on every start (the session, the navigation, the full-page
// states, mutations, the kept copy's store) and the rest of zod: the same bytes in fewer files.
const uiModules = (id: string) =>
  (/[\\/]src[\\/](components[\\/]ui|config)[\\/]|[\\/]src[\\/]lib[\\/](cn|use-media-query)\.ts$/.test(id) ||
    /[\\/]src[\\/]app[\\/](session|nav)\.ts$|[\\/]src[\\/]app[\\/]routes[\\/]full-page-states\.tsx$|[\\/]packages[\\/]shared[\\/]src[\\/]permissions\.ts$/.test(id) ||
    /[\\/]node_modules[\\/](zod|idb-keyval)[\\/]|[\\/]@tanstack[\\/](query-core[\\/]build[\\/]modern[\\/](mutation|mutationObserver)|react-query[\\/]build[\\/]modern[\\/]useMutation)\.js$/.test(id)) &&
  !/[\\/](app-toaster|data-table)\.tsx$/.test(id);

// The tickets' common ground (their records, keys, requests, deadlines and badges), shared by the board, the
// home page, a ticket and its field page: one file instead of a dozen of under a kilobyte each. Over
// HTTP/1.1 a phone fetches six files at a time, and each small file costs a round trip.
const ticketModules = (id: string) =>
  /[\\/]src[\\/]features[\\/]work-orders[\\/](api[\\/](keys|get-work-orders?|get-sites|get-technicians)|lib[\\/](list-params|sla)|hooks[\\/]use-now)\.ts$/.test(id) ||
  /[\\/]src[\\/]features[\\/]work-orders[\\/]components[\\/](status-badge|sla-clock)\.tsx$/.test(id) ||
  /[\\/]packages[\\/]shared[\\/]src[\\/](pagination|work-orders|zoned-time|asset-records)\.ts$/.test(id);

export default defineConfig({
  plugins: [
    react(),
    preloadStartChunks(/[\\/]src[\\/]app[\\/]start\.tsx$/),
    coreFonts({ outDir: fileURLToPath(new URL('./generated/fonts', import.meta.url)), css: fileURLToPath(new URL('./src/fonts.css', import.meta.url)) }),
    preloadFonts(/assets\/(inter|space-grotesk)-core-wght-normal-[\w-]+\.woff2$/),
    firstPagesManifest(),
    brotliCopies(),
    tailwindcss(),
    // Installable app with the shell precached, so a technician's phone opens Stringfield without
    // signal. API answers are never cached by the service worker: the app keeps its own copy of the
    // data it needs (TanStack Query persisted to IndexedDB), per person, and clears it on sign-out.
    VitePWA({
      registerType: 'autoUpdate',
      strategies: 'generateSW',
      // Registered from main.tsx (no inline script: the API's CSP is script-src 'self').
      injectRegister: false,
      includeAssets: ['favicon.svg', 'apple-touch-icon.png'],
      manifest: {
        name: 'Stringfield',
        short_name: 'Stringfield',
        description: 'DC string fault work orders and field checks for PV operations and maintenance crews',
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: token('brand', '#0e4b4f'),
        background_color: token('paper', '#f6f4ee'),
        icons: [
          { src: '/pwa-192x192.png', sizes: '192x192', type: 'image/png' },
          { src: '/pwa-512x512.png', sizes: '512x512', type: 'image/png' },
          { src: '/pwa-maskable-512x512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/favicon.svg', sizes: 'any', type: 'image/svg+xml' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        // No runtimeCaching: nothing under /api is ever stored by the service worker.
        runtimeCaching: [],
      },
      devOptions: { enabled: false },
    }),
  ],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  preview: {
    host: '127.0.0.1',
    port: 4173,
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // Never inline assets as data: URIs into scripts or the HTML; the strict CSP serves files only.
    assetsInlineLimit: 0,
    modulePreload: { polyfill: false },
    sourcemap: false,
    // dist/.vite/manifest.json maps each route module to its chunk and static imports, so the
    // bundle-size check can add up what a first page needs.
    manifest: true,
    rolldownOptions: {
      output: {
        // React and the router change rarely: a separate file stays cached across our releases.
        codeSplitting: {
          groups: [
            { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler|react-router)[\\/]/, priority: 20 },
            // The design system and the app's small shared helpers in one file: a route otherwise
            // waits on a dozen 1–2 KB files, each a round trip on a phone's connection.
            { name: 'ui', test: uiModules, priority: 10 },
            // Only the modules listed: with their dependencies the group would also take TanStack's query
            // core and the early answers, which the app's start-up needs on every page, sign-in included.
            { name: 'tickets', test: ticketModules, priority: 5, includeDependenciesRecursively: false },
          ],
        },
      },
    },
  },
});
