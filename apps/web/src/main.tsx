/// <reference types="vite-plugin-pwa/client" />
import '@fontsource-variable/inter';
import '@fontsource-variable/space-grotesk';
import './styles.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router';
import { startMeEarly } from '@/features/auth/api/get-me';
import { toast } from '@/lib/toast';
import { registerSW } from 'virtual:pwa-register';
import { AppProvider } from './app/provider';
import { router } from './app/router';

startMeEarly();

const container = document.getElementById('root');
if (!container) throw new Error('The page has no #root element');

createRoot(container).render(
  <StrictMode>
    <AppProvider>
      <RouterProvider router={router} />
    </AppProvider>
  </StrictMode>,
);

// The service worker exists only in a production build. A new release takes over at once; the page
// reloads into it, except on a field page where a reading may be half typed: there it asks first.
// Registered after the page has loaded, so the worker's precache downloads do not compete with the
// first page's code and data on a slow connection.
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

if (import.meta.env.PROD) {
  if (document.readyState === 'complete') registerServiceWorker();
  else window.addEventListener('load', registerServiceWorker, { once: true });
}
