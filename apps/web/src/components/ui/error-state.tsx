import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { Button } from './button';
import { Icon } from './icon';

/** A failed load: what happened in plain words, a retry, and the request id for whoever reads the logs. */
export function ErrorState({
  title = 'This did not load',
  error,
  onRetry,
  isRetrying = false,
  className,
}: {
  title?: string;
  error: unknown;
  onRetry?: () => void;
  isRetrying?: boolean;
  className?: string;
}) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  const requestId = isApiError(error) ? error.requestId : undefined;
  return (
    <div role="alert" className={cn('flex flex-col items-center rounded-card border-2 border-fail/40 bg-fail-soft px-6 py-8 text-center', className)}>
      <Icon name="fail" className="mb-3 size-10 text-fail" />
      <h2 className="text-xl font-semibold">{title}</h2>
      <p className="mt-2 max-w-prose text-ink">{message}</p>
      {requestId ? <p className="mt-2 text-xs text-ink-faint">Reference: <span className="readings font-mono">{requestId}</span></p> : null}
      {onRetry ? (
        <Button variant="secondary" className="mt-5" onClick={onRetry} isPending={isRetrying}>
          {isRetrying ? null : <Icon name="refresh" />}
          Try again
        </Button>
      ) : null}
    </div>
  );
}
