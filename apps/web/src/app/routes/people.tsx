import type { User } from '@stringfield/shared';
import type { SortingState, Updater } from '@tanstack/react-table';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { toSearch } from '@/config/paths';
import { useUsers } from '@/features/users/api/get-users';
import { InviteUserDialog } from '@/features/users/components/invite-user-dialog';
import { ManageUserDialog } from '@/features/users/components/manage-user-dialog';
import { UsersFilters } from '@/features/users/components/users-filters';
import { UsersTable } from '@/features/users/components/users-table';
import {
  parseUsersListParams,
  sortingFromParam,
  sortParamFromSorting,
  usersListSearch,
  type UsersListParams,
} from '@/features/users/lib/list-params';
import { useSessionUser } from '../session';

/** People: every account, filterable and sortable, with the state in the URL so a view can be shared. */
export function PeopleRoute() {
  const currentUser = useSessionUser();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseUsersListParams(searchParams);
  const users = useUsers(params);
  const [isInviting, setIsInviting] = useState(false);
  const [managedUser, setManagedUser] = useState<User | null>(null);

  const update = (changes: Partial<UsersListParams>, options: { replace?: boolean } = {}) => {
    // Any change of filter or order starts again at page 1; paging itself keeps the rest.
    const next = { ...params, page: 1, ...changes };
    setSearchParams(toSearch(usersListSearch(next)), { replace: options.replace ?? false, preventScrollReset: true });
  };

  const sorting = sortingFromParam(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const nextSorting = typeof updater === 'function' ? updater(sorting) : updater;
    update({ sort: sortParamFromSorting(nextSorting) });
  };

  const hasFilters = params.q !== '' || params.role !== undefined || params.status !== 'all';
  const data = users.data;
  // Keep the dialog's copy fresh after a save re-fetches the list.
  const managed = managedUser ? (data?.items.find((u) => u.id === managedUser.id) ?? managedUser) : null;

  return (
    <>
      <PageHeader
        title="People"
        description="Everyone who can sign in to Stringfield, and what their role lets them do."
        actions={
          <Button variant="primary" onClick={() => setIsInviting(true)}>
            <Icon name="plus" /> Invite person
          </Button>
        }
      />

      <UsersFilters value={params} onChange={(changes) => update(changes, { replace: 'q' in changes && Object.keys(changes).length === 1 })} />

      {users.isError && !data ? (
        <ErrorState title="People did not load" error={users.error} onRetry={() => void users.refetch()} isRetrying={users.isFetching} />
      ) : (
        <>
          <UsersTable
            users={data?.items ?? []}
            sorting={sorting}
            onSortingChange={onSortingChange}
            isLoading={users.isPending}
            isFetching={users.isPlaceholderData}
            actions={{ currentUserId: currentUser.id, onManage: setManagedUser }}
            emptyState={
              hasFilters ? (
                <EmptyState
                  icon="search"
                  title="Nobody matches these filters"
                  description="Try a shorter search, or another role or status."
                  action={
                    <Button variant="secondary" onClick={() => update({ q: '', role: undefined, status: 'all' })}>
                      Clear filters
                    </Button>
                  }
                />
              ) : (
                <EmptyState
                  icon="people"
                  title="No one here yet"
                  description="Invite your dispatchers, technicians, supervisors and asset owners."
                  action={
                    <Button variant="primary" onClick={() => setIsInviting(true)}>
                      <Icon name="plus" /> Invite person
                    </Button>
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
              itemLabel={data.total === 1 ? 'person' : 'people'}
              onPageChange={(page) => update({ page })}
            />
          ) : null}
        </>
      )}

      <InviteUserDialog isOpen={isInviting} onClose={() => setIsInviting(false)} />
      <ManageUserDialog user={managed} currentUserId={currentUser.id} onClose={() => setManagedUser(null)} />
    </>
  );
}
