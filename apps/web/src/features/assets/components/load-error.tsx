import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { isApiError } from '@/lib/api-client';

/**
 * A page's main record did not load. A 404 is not a fault to retry: the record is gone, or (for
 * an asset owner) belongs to someone else's site, so say so and offer a way back instead.
 */
export function LoadError({
  what,
  error,
  onRetry,
  isRetrying,
  backTo,
  backLabel,
}: {
  what: string;
  error: unknown;
  onRetry: () => void;
  isRetrying: boolean;
  backTo: string;
  backLabel: string;
}) {
  if (isApiError(error) && error.status === 404)
    return (
      <EmptyState
        icon="compass"
        title={`This ${what} is not here`}
        description={`It may have been removed, or it is not one you have access to. ${error.message}`}
        action={
          <ButtonLink to={backTo} variant="brand">
            {backLabel}
          </ButtonLink>
        }
      />
    );
  return <ErrorState title={`This ${what} did not load`} error={error} onRetry={onRetry} isRetrying={isRetrying} />;
}
