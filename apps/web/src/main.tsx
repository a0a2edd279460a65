/// <reference types="vite-plugin-pwa/client" />
import '@fontsource-variable/inter';
import '@fontsource-variable/space-grotesk';
import './fonts.css';
import './styles.css';
import { afterPageSettles, nextTask } from '@/lib/after-load';
import { toast } from '@/lib/toast';
import { registerSW } from 'virtual:pwa-register';
import { prepareFirstPage, preloadFirstPage } from './app/first-page';
import { showStartFailure } from './app/start-failure';

// The static frame in index.html is on screen already. Starting the app is split into short tasks
// rather than one long one, so a phone's main thread is never held for long and a tap is answered in
// between: this file has no import of React or zod, and each step builds one piece (React, its DOM
// renderer and the router, which are one file; then zod, the design system and who is signed in; the
// first page's code; the browser's locale data for a page that formats dates as it draws; the app's
// modules; the router; then the first render, which React slices itself). Their files are already
// downloading (modulepreload in index.html, see vite.config.ts), as is the answer to who is signed in
// (a preload the API adds to the HTML, apps/api/src/lib/web-shell.ts).
// Should one of those downloads fail (a file gone after a release, the connection dropping), the
// loading frame says so and offers a reload instead of waiting forever.
let isReactRendering = false;
start().catch((error: unknown) => showStartFailure(error, { isReactRendering }));

async function start() {
  const { createRoot } = await import('react-dom/client');
  await nextTask();
  const { startMeEarly } = await import('@/features/auth/api/get-me');
  startMeEarly();
  await nextTask();
  preloadFirstPage(window.location);
  await nextTask();
  prepareFirstPage(window.location);
  await nextTask();
  const container = document.getElementById('root');
  if (!container) throw new Error('The page has no #root element');
  const root = createRoot(container);
  await nextTask();
  const { createAppRouter, renderApp } = await import('./app/start');
  await nextTask();
  const router = createAppRouter();
  await nextTask();
  isReactRendering = true;
  renderApp(root, router);
}

// The service worker exists only in a production build. A new release takes over at once; the page
// reloads into it, except on a field page where a reading may be half typed: there it asks first.
// Registered a few seconds after the page has loaded, so the worker and its precache downloads do not
// compete with the first page's code and data on a slow connection.
function registerServiceWorker() {
  registerSW({
    immediate: true,
    onNeedReload: () => {
      if (!window.location.pathname.endsWith('/field')) {
        window.location.reload();
        return;
      }
      toast('A new version of Stringfield is ready', {
        description: 'Save or cancel the reading you are typing, then reload.',
        duration: Infinity,
        action: { label: 'Reload', onClick: () => window.location.reload() },
      });
    },
  });
}

if (import.meta.env.PROD) afterPageSettles(registerServiceWorker, 3_000);
