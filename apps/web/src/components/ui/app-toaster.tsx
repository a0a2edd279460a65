import { useEffect } from 'react';
import { Toaster } from 'sonner';
import { markToasterMounted } from '@/lib/toast';

/** The app's toaster, in the house style; loaded lazily by the provider (see lib/toast.ts). */
export function AppToaster() {
  // Runs after Toaster's own effects, so it is subscribed when queued toasts are sent.
  useEffect(() => markToasterMounted(), []);
  return (
    <Toaster
      // The app is English only (index.html: lang="en", no dir). Said here, Sonner need not ask the
      // browser, which would force a style pass of the whole page while the first page is still mounting.
      dir="ltr"
      position="top-center"
      closeButton
      duration={6000}
      gap={10}
      offset={16}
      toastOptions={{
        classNames: {
          toast: '!rounded-card !border-2 !border-edge !bg-surface !text-ink !text-base !font-sans !shadow-raised !p-4 !pr-14',
          title: '!font-semibold',
          description: '!text-ink-muted',
          success: '!border-pass',
          error: '!border-fail',
          // Inside the toast's corner and big enough for a thumb (Sonner's own is 20 px, astride the corner).
          closeButton: '!top-2 !right-2 !left-auto !size-10 ![transform:none] !border-edge !bg-surface !text-ink [&>svg]:!size-5',
        },
      }}
    />
  );
}
