import { roleLabels, type User } from '@stringfield/shared';
import { createColumnHelper, type OnChangeFn, type SortingState } from '@tanstack/react-table';
import { format, parseISO } from 'date-fns';
import type { ReactNode } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { UserActionsContext, useUserActions, type UserActions } from './user-actions-context';
import { UserStatusBadge } from './user-status-badge';

function formatDay(iso: string | null): string {
  if (!iso) return 'Never';
  try {
    return format(parseISO(iso), 'd MMM yyyy');
  } catch {
    return iso;
  }
}

function NameCell({ user }: { user: User }) {
  const { currentUserId } = useUserActions();
  return (
    <div className="min-w-0">
      <span className="font-semibold text-ink">{user.name}</span>
      {user.id === currentUserId ? (
        <Badge tone="brand" icon={null} className="ml-2 align-middle">
          You
        </Badge>
      ) : null}
      <span className="block text-sm [overflow-wrap:anywhere] text-ink-muted">{user.email}</span>
    </div>
  );
}

function ManageButton({ user }: { user: User }) {
  const { onManage } = useUserActions();
  return (
    <Button variant="secondary" onClick={() => onManage(user)} className="w-full md:w-auto">
      Manage<span className="sr-only"> {user.name}</span>
    </Button>
  );
}

const column = createColumnHelper<User>();

const columns = [
  column.accessor('name', {
    header: 'Name and e-mail',
    cell: (info) => <NameCell user={info.row.original} />,
    meta: { isCardTitle: true },
  }),
  column.accessor('role', {
    header: 'Role',
    cell: (info) => <span className="whitespace-nowrap">{roleLabels[info.getValue()]}</span>,
    meta: { label: 'Role' },
  }),
  column.display({
    id: 'status',
    header: 'Status',
    cell: (info) => <UserStatusBadge user={info.row.original} />,
    meta: { label: 'Status' },
  }),
  column.accessor('lastSignInAt', {
    header: 'Last sign-in',
    enableSorting: false,
    cell: (info) => <span className="readings whitespace-nowrap">{formatDay(info.getValue())}</span>,
    meta: { label: 'Last sign-in' },
  }),
  column.accessor('createdAt', {
    header: 'Added',
    cell: (info) => <span className="readings whitespace-nowrap">{formatDay(info.getValue())}</span>,
    meta: { label: 'Added' },
  }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (info) => <ManageButton user={info.row.original} />,
    meta: { className: 'text-right' },
  }),
];

export function UsersTable({
  users,
  sorting,
  onSortingChange,
  isLoading,
  isFetching,
  emptyState,
  actions,
}: {
  users: User[];
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  isLoading: boolean;
  isFetching: boolean;
  emptyState: ReactNode;
  actions: UserActions;
}) {
  return (
    <UserActionsContext value={actions}>
      <DataTable
        caption="People"
        columns={columns}
        data={users}
        getRowId={(user) => String(user.id)}
        sorting={sorting}
        onSortingChange={onSortingChange}
        isLoading={isLoading}
        isFetching={isFetching}
        emptyState={emptyState}
      />
    </UserActionsContext>
  );
}
