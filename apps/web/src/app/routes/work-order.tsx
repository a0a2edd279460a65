import { Link, useParams } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useWorkOrder } from '@/features/work-orders/api/get-work-order';
import { WorkOrderView } from '@/features/work-orders/components/work-order-view';
import { isApiError } from '@/lib/api-client';
import { useSessionUser } from '../session';

function TicketSkeleton() {
  return (
    <LoadingRegion label="Loading the ticket" className="flex flex-col gap-6">
      <div className="flex flex-col gap-4 rounded-card border border-line bg-surface p-6">
        <Skeleton className="h-4 w-40" />
        <Skeleton className="h-9 w-3/4" />
        <div className="flex gap-2">
          <Skeleton className="h-7 w-28" />
          <Skeleton className="h-7 w-24" />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Skeleton className="h-12" />
          <Skeleton className="h-12" />
        </div>
        <Skeleton className="h-14 w-full sm:w-48" />
      </div>
      <Skeleton className="h-32" />
      <Skeleton className="h-48" />
    </LoadingRegion>
  );
}

/** One work order, by id: `/work-orders/:workOrderId`. */
export function WorkOrderRoute() {
  const user = useSessionUser();
  const { workOrderId } = useParams();
  const id = Number(workOrderId);
  const isValidId = Number.isInteger(id) && id > 0;
  const ticket = useWorkOrder(isValidId ? id : 0);
  const back =
    user.role === 'technician'
      ? { to: paths.home(), label: 'My work' }
      : { to: paths.workOrders(), label: 'Work orders' };

  const backLink = (
    <Link
      to={back.to}
      className="mb-4 inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline"
    >
      <Icon name="chevronLeft" /> {back.label}
    </Link>
  );

  if (!isValidId || (ticket.isError && isApiError(ticket.error) && ticket.error.status === 404)) {
    return (
      <>
        {backLink}
        <EmptyState
          icon="search"
          title="That work order is not here"
          description={
            user.role === 'owner'
              ? 'Only signed-off tickets of your own sites can be opened. It may not be signed off yet.'
              : 'The link may be mistyped, or the ticket is not visible to your role.'
          }
          action={
            <ButtonLink to={back.to} variant="secondary">
              Back to {back.label.toLowerCase()}
            </ButtonLink>
          }
        />
      </>
    );
  }

  return (
    <div className="mx-auto max-w-5xl">
      {backLink}
      {ticket.isPending ? (
        <TicketSkeleton />
      ) : ticket.isError && !ticket.data ? (
        <ErrorState
          title="The ticket did not load"
          error={ticket.error}
          onRetry={() => void ticket.refetch()}
          isRetrying={ticket.isFetching}
        />
      ) : ticket.data ? (
        <WorkOrderView
          // A different ticket starts with fresh drafts; the same one keeps them across reloads.
          key={ticket.data.id}
          ticket={ticket.data}
          role={user.role}
          isReloading={ticket.isRefetching}
          onReload={async () => (await ticket.refetch()).data}
        />
      ) : null}
    </div>
  );
}
