import { startTransition, StrictMode } from 'react';
import type { Root } from 'react-dom/client';
import { RouterProvider } from 'react-router';
import { AppProvider } from './provider';
import { createAppRouter } from './router';

export { createAppRouter };

/**
 * The first render, as a transition: React renders it in slices of a few milliseconds and lets the
 * browser handle input in between, instead of holding the main thread for the whole tree.
 */
export function renderApp(root: Root, router: ReturnType<typeof createAppRouter>): void {
  startTransition(() => {
    root.render(
      <StrictMode>
        <AppProvider>
          <RouterProvider router={router} />
        </AppProvider>
      </StrictMode>,
    );
  });
}
