import type { ExternalToast } from 'sonner';

// The toast library is ~10 kB of script that no first page needs: it loads with the toaster
// (components/ui/app-toaster.tsx, lazy), and a toast asked for before then waits for it.

type Kind = 'message' | 'success' | 'error' | 'warning';

let markMounted: () => void = () => {};
const isMounted = new Promise<void>((resolve) => {
  markMounted = resolve;
});

/** Called once the toaster is on screen and listening; toasts asked for earlier show then. */
export function markToasterMounted() {
  markMounted();
}

function show(kind: Kind, message: string, data?: ExternalToast) {
  void isMounted
    .then(() => import('sonner'))
    .then(({ toast }) => {
      if (kind === 'message') toast(message, data);
      else toast[kind](message, data);
    });
}

/** Sonner's toast calls (message, success, error, warning), without loading Sonner up front. */
export const toast = Object.assign((message: string, data?: ExternalToast) => show('message', message, data), {
  success: (message: string, data?: ExternalToast) => show('success', message, data),
  error: (message: string, data?: ExternalToast) => show('error', message, data),
  warning: (message: string, data?: ExternalToast) => show('warning', message, data),
});
