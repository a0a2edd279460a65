import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { Toaster } from 'sonner';
import { authKeys } from '@/features/auth/api/keys';
import { createQueryClient } from '@/lib/query-client';

/** Everything the app runs inside: the query cache and the toast outlet. */
export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(() => {
    const client = createQueryClient({
      // Any 401 means the session is gone (expired, or an administrator ended it): forget the person,
      // and the protected layout sends them to sign in with a way back.
      onUnauthenticated: () => client.setQueryData(authKeys.me(), null),
    });
    return client;
  });

  return (
    <QueryClientProvider client={queryClient}>
      {children}
      <Toaster
        position="top-center"
        closeButton
        duration={6000}
        gap={10}
        offset={16}
        toastOptions={{
          classNames: {
            toast: '!rounded-card !border-2 !border-edge !bg-surface !text-ink !text-base !font-sans !shadow-raised !p-4',
            title: '!font-semibold',
            description: '!text-ink-muted',
            success: '!border-pass',
            error: '!border-fail',
            closeButton: '!border-edge !bg-surface !text-ink',
          },
        }}
      />
    </QueryClientProvider>
  );
}
