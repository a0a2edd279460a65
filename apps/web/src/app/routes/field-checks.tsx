import { can, type SessionUser } from '@stringfield/shared';
import { useDeferredValue } from 'react';
import { Link, matchPath, useParams } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, routes } from '@/config/paths';
import { FieldPage } from '@/features/field-checks/components/field-page';
import { getStringSpec, stringSpecQueryOptions } from '@/features/field-checks/api/get-string-spec';
import { getTicketChecks, ticketChecksQueryOptions } from '@/features/field-checks/api/get-ticket-checks';
import { getWorkOrder, useWorkOrder, workOrderQueryOptions } from '@/features/work-orders/api/get-work-order';
import { isApiError } from '@/lib/api-client';
import { startEarly } from '@/lib/early-answers';
import type { FirstLocation } from '../first-page';
import { useSessionUser } from '../session';

/**
 * The field page's first answers, asked for as its code arrives: the ticket and its checks at once, and
 * each string's datasheet as soon as the ticket says which strings it has.
 */
export function startFirstAnswers(_user: SessionUser, location: FirstLocation) {
  const id = Number(matchPath(routes.fieldChecks, location.pathname)?.params.workOrderId);
  if (!Number.isInteger(id) || id <= 0) return;
  startEarly(ticketChecksQueryOptions(id).queryKey, () => getTicketChecks(id));
  startEarly(workOrderQueryOptions(id).queryKey, async () => {
    const ticket = await getWorkOrder(id);
    for (const { id: stringId } of ticket.strings) {
      startEarly(stringSpecQueryOptions(stringId).queryKey, () => getStringSpec(stringId));
    }
    return ticket;
  });
}

function FieldSkeleton() {
  return (
    <LoadingRegion label="Loading the field page" className="mx-auto flex max-w-3xl flex-col gap-4">
      <Skeleton className="h-5 w-40" />
      <Skeleton className="h-9 w-2/3" />
      <Skeleton className="h-24 w-full rounded-card" />
      <Skeleton className="h-24 w-full rounded-card" />
    </LoadingRegion>
  );
}

/**
 * `/work-orders/:workOrderId/field`: the technician's field checks of one ticket. The ticket comes
 * from the work-orders feature (the same cached copy as the ticket page, so it opens offline too).
 */
export function FieldChecksRoute() {
  const user = useSessionUser();
  const { workOrderId } = useParams();
  const id = Number(workOrderId);
  const isValidId = Number.isInteger(id) && id > 0;
  const ticket = useWorkOrder(isValidId ? id : 0);
  // The field page is a large render. TanStack's updates render synchronously; through deferred values
  // the page follows the answer in a background render that React does in short slices, so the main
  // thread stays free for input meanwhile.
  const data = useDeferredValue(ticket.data);
  const isPending = useDeferredValue(ticket.isPending);

  if (!isValidId || (ticket.isError && isApiError(ticket.error) && ticket.error.status === 404)) {
    return (
      <EmptyState
        icon="search"
        title="That work order is not here"
        description="The link may be mistyped, or the ticket is not visible to your role."
        action={
          <ButtonLink to={paths.home()} variant="secondary">
            Back to my work
          </ButtonLink>
        }
      />
    );
  }
  if (isPending && ticket.fetchStatus === 'paused') {
    return (
      <EmptyState
        icon="inbox"
        title="This ticket is not on this phone yet"
        description="There is no connection, and the ticket was not opened here before. Open it once with signal and it stays available offline."
        action={
          <ButtonLink to={paths.home()} variant="secondary">
            Back to my work
          </ButtonLink>
        }
      />
    );
  }
  if (isPending) return <FieldSkeleton />;
  if (!data) {
    return (
      <div className="mx-auto max-w-3xl">
        <Link to={paths.home()} className="mb-4 inline-flex min-h-touch items-center gap-1 font-semibold text-brand">
          <Icon name="chevronLeft" /> My work
        </Link>
        <ErrorState
          title="The ticket did not load"
          error={ticket.error}
          onRetry={() => void ticket.refetch()}
          isRetrying={ticket.isFetching}
        />
      </div>
    );
  }
  return <FieldPage key={data.id} ticket={data} userId={user.id} canRecord={can(user.role, 'checks:record')} />;
}
