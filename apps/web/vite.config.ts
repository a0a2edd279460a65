import { readFileSync } from 'node:fs';
import { fileURLToPath, URL } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';

// The API runs on 8080 in development; the browser only ever talks to its own origin, so
// cookies stay first-party and the API's CSP (`script-src 'self'`) holds for the built app.
const apiTarget = process.env.STRINGFIELD_API_URL ?? 'http://127.0.0.1:8080';

// The installed app's colours come from the design tokens, so the splash screen matches the header.
const tokens = readFileSync(fileURLToPath(new URL('./src/styles.css', import.meta.url)), 'utf8');
const token = (name: string, fallback: string) => new RegExp(`--color-${name}:\\s*(#[0-9a-fA-F]{6})`).exec(tokens)?.[1] ?? fallback;

export default defineConfig({
  plugins: [
    react(),
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
          ],
        },
      },
    },
  },
});
