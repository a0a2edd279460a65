import { can, type SessionUser, type WorkOrderListItem } from '@stringfield/shared';
import type { SortingState, Updater } from '@tanstack/react-table';
import { useDeferredValue, useState } from 'react';
import { useLocation, useSearchParams } from 'react-router';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { paths, toSearch } from '@/config/paths';
import { getSiteOptions, siteOptionsQueryOptions } from '@/features/work-orders/api/get-sites';
import { getTechnicians, techniciansQueryOptions } from '@/features/work-orders/api/get-technicians';
import { getWorkOrders, useWorkOrders, workOrdersQueryOptions } from '@/features/work-orders/api/get-work-orders';
import { BoardViews } from '@/features/work-orders/components/board-views';
import { BulkAssignDialog } from '@/features/work-orders/components/bulk-assign-dialog';
import { WorkOrderFilters } from '@/features/work-orders/components/work-order-filters';
import { WorkOrderTable } from '@/features/work-orders/components/work-order-table';
import {
  defaultWorkOrderListParams,
  hasWorkOrderFilters,
  parseWorkOrderListParams,
  sortingFromParam,
  sortParamFromSorting,
  workOrderListSearch,
  type WorkOrderListParams,
} from '@/features/work-orders/lib/list-params';
import { startEarly } from '@/lib/early-answers';
import type { FirstLocation } from '../first-page';
import { useSessionUser } from '../session';

/** The board's first answers (the page of tickets, and the filters' sites and technicians), asked for as its code arrives. */
export function startFirstAnswers(user: SessionUser, location: FirstLocation) {
  const params = parseWorkOrderListParams(new URLSearchParams(location.search), user.role);
  startEarly(workOrdersQueryOptions(params).queryKey, () => getWorkOrders(params));
  startEarly(siteOptionsQueryOptions().queryKey, () => getSiteOptions());
  if (can(user.role, 'workOrders:dispatch')) startEarly(techniciansQueryOptions().queryKey, () => getTechnicians());
}

/** The dispatcher board: every ticket the person may see, filtered, sorted and paged by the server, the view in the URL. */
export function WorkOrdersRoute() {
  const user = useSessionUser();
  const role = user.role;
  const location = useLocation();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseWorkOrderListParams(searchParams, role);
  const workOrders = useWorkOrders(params);
  const canDispatch = can(role, 'workOrders:dispatch');
  const canCreate = can(role, 'workOrders:create');
  const [selected, setSelected] = useState<ReadonlyMap<number, WorkOrderListItem>>(new Map());
  const [assigning, setAssigning] = useState<WorkOrderListItem[] | null>(null);

  const update = (changes: Partial<WorkOrderListParams>, options: { replace?: boolean } = {}) => {
    // Any change of filter or order starts again at page 1; paging itself keeps the rest.
    const next = { ...params, page: 1, ...changes };
    setSearchParams(toSearch(workOrderListSearch(next, role)), {
      replace: options.replace ?? false,
      preventScrollReset: true,
    });
  };

  const sorting = sortingFromParam(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const nextSorting = typeof updater === 'function' ? updater(sorting) : updater;
    update({ sort: sortParamFromSorting(nextSorting) });
  };

  const hasFilters = hasWorkOrderFilters(params, role);
  // A page of tickets is the board's heaviest render. TanStack's updates render synchronously; through
  // deferred values the table follows the answer in a background render that React does in short
  // slices, so the main thread stays free for input meanwhile.
  const data = useDeferredValue(workOrders.data);
  const isLoading = useDeferredValue(workOrders.isPending);
  const isStale = useDeferredValue(workOrders.isPlaceholderData);
  const pageItems = data?.items ?? [];
  const clear = () => update({ ...defaultWorkOrderListParams(role), sort: params.sort });

  const selection = canDispatch
    ? {
        selected,
        pageItems,
        onToggle: (item: WorkOrderListItem, isSelected: boolean) =>
          setSelected((current) => {
            const next = new Map(current);
            if (isSelected) next.set(item.id, item);
            else next.delete(item.id);
            return next;
          }),
        onTogglePage: (isSelected: boolean) =>
          setSelected((current) => {
            const next = new Map(current);
            for (const item of pageItems) {
              if (isSelected) next.set(item.id, item);
              else next.delete(item.id);
            }
            return next;
          }),
      }
    : undefined;

  return (
    <>
      <PageHeader
        title="Work orders"
        description={
          role === 'owner'
            ? 'Signed-off repairs on your sites, with what was found and done.'
            : 'Every DC string fault ticket, with who has it and how long is left to fix it.'
        }
        actions={
          canCreate ? (
            <ButtonLink
              to={paths.newWorkOrder(params.siteId ? { siteId: params.siteId } : {})}
              variant="primary"
            >
              <Icon name="plus" /> New ticket
            </ButtonLink>
          ) : undefined
        }
      />

      <BoardViews role={role} currentSearch={location.search} />
      <WorkOrderFilters
        value={params}
        role={role}
        hasFilters={hasFilters}
        onChange={update}
        onClear={clear}
      />

      {selection && selected.size > 0 ? (
        <div className="sticky top-16 z-20 mb-4 flex flex-wrap items-center gap-3 rounded-card border-2 border-brand bg-brand-soft p-3 shadow-card lg:top-4">
          <p className="font-semibold" aria-live="polite">
            {selected.size} selected
          </p>
          <Button variant="primary" onClick={() => setAssigning([...selected.values()])}>
            <Icon name="user" /> Assign to…
          </Button>
          <Button variant="ghost" onClick={() => setSelected(new Map())}>
            Clear selection
          </Button>
        </div>
      ) : null}

      {workOrders.isError && !data ? (
        <ErrorState
          title="The work orders did not load"
          error={workOrders.error}
          onRetry={() => void workOrders.refetch()}
          isRetrying={workOrders.isFetching}
        />
      ) : (
        <>
          <WorkOrderTable
            items={pageItems}
            sorting={sorting}
            onSortingChange={onSortingChange}
            isLoading={isLoading}
            isFetching={isStale}
            selection={selection}
            emptyState={
              hasFilters ? (
                <EmptyState
                  icon="search"
                  title="No ticket matches these filters"
                  description="Try a shorter search, another site, or more statuses."
                  action={
                    <Button variant="secondary" onClick={clear}>
                      Clear filters
                    </Button>
                  }
                />
              ) : role === 'owner' ? (
                <EmptyState
                  icon="file"
                  title="No signed-off repairs yet"
                  description="When work on your sites is signed off, it is listed here."
                />
              ) : (
                <EmptyState
                  icon="clipboard"
                  title="No open work orders"
                  description="Every reported string fault is dealt with. New tickets appear here as soon as they are opened."
                  action={
                    canCreate ? (
                      <ButtonLink to={paths.newWorkOrder()} variant="primary">
                        <Icon name="plus" /> New ticket
                      </ButtonLink>
                    ) : undefined
                  }
                />
              )
            }
          />
          {data && data.total > 0 ? (
            <Pagination
              className="mt-5"
              page={data.page}
              pageSize={data.pageSize}
              total={data.total}
              itemLabel={data.total === 1 ? 'ticket' : 'tickets'}
              onPageChange={(page) => update({ page })}
            />
          ) : null}
        </>
      )}

      {assigning ? (
        <BulkAssignDialog
          items={assigning}
          onClose={() => setAssigning(null)}
          onDone={(ids) =>
            setSelected((current) => {
              const next = new Map(current);
              for (const id of ids) next.delete(id);
              return next;
            })
          }
        />
      ) : null}
    </>
  );
}
