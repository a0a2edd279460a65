import { ErrorState } from '@/components/ui/error-state';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { Wordmark } from '@/components/ui/wordmark';

/** While we find out who is signed in: the frame's shape, without content. */
export function SessionLoading() {
  return (
    <LoadingRegion label="Loading Stringfield" className="min-h-dvh lg:pl-64">
      <div className="on-brand flex h-14 items-center bg-brand px-4 text-on-brand lg:hidden">
        <Wordmark isCompact />
      </div>
      <div className="on-brand fixed inset-y-0 left-0 hidden w-64 bg-brand px-6 pt-7 text-on-brand lg:block">
        <Wordmark />
      </div>
      <div className="mx-auto flex max-w-4xl flex-col gap-4 px-4 pt-6 lg:px-10 lg:pt-10">
        <Skeleton className="h-5 w-32" />
        <Skeleton className="h-9 w-64" />
        <Skeleton className="h-48 w-full rounded-card" />
      </div>
    </LoadingRegion>
  );
}

export function SessionError({ error, onRetry, isRetrying }: { error: unknown; onRetry: () => void; isRetrying: boolean }) {
  return (
    <main id="main" className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center gap-6 px-4">
      <Wordmark className="text-brand" />
      <ErrorState title="Stringfield did not start" error={error} onRetry={onRetry} isRetrying={isRetrying} />
    </main>
  );
}
