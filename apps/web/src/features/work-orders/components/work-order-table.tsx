import type { WorkOrderListItem } from '@stringfield/shared';
import { createColumnHelper, type OnChangeFn, type SortingState } from '@tanstack/react-table';
import { useEffect, useRef, type ReactNode } from 'react';
import { Link } from 'react-router';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { BoardSelectionContext, useBoardSelection, type BoardSelection } from './board-selection-context';
import { SlaClock } from './sla-clock';
import { PriorityBadge, StatusBadge } from './status-badge';

function TicketCell({ item }: { item: WorkOrderListItem }) {
  return (
    <div className="min-w-0">
      <span className="readings block text-sm font-semibold text-ink-muted">
        {item.number} ·{' '}
        <abbr title={item.site.name} className="no-underline">
          {item.site.code}
        </abbr>
        <span className="sr-only">, {item.site.name}</span>
      </span>
      <Link
        to={paths.workOrder(item.id)}
        // A title may hold a long unbroken token (a pasted path, a serial): it breaks rather than widen the column.
        className="font-semibold text-brand underline-offset-4 [overflow-wrap:anywhere] hover:underline"
      >
        {item.title}
      </Link>
    </div>
  );
}

function StringsCell({ item }: { item: WorkOrderListItem }) {
  const shown = item.stringLabels.slice(0, 2);
  const more = item.stringCount - shown.length;
  if (item.stringCount === 0) return <span className="text-ink-muted">—</span>;
  return (
    <span className="readings flex flex-col text-sm whitespace-nowrap md:items-start">
      {shown.map((label) => (
        <span key={label}>{label}</span>
      ))}
      {more > 0 ? <span className="font-semibold text-ink-muted">+{more} more</span> : null}
    </span>
  );
}

function SelectCell({ item }: { item: WorkOrderListItem }) {
  const { selected, onToggle } = useBoardSelection();
  return (
    <label className="-m-2 flex min-h-touch min-w-touch cursor-pointer items-center md:justify-center">
      <input
        type="checkbox"
        className="size-6 accent-brand"
        checked={selected.has(item.id)}
        onChange={(event) => onToggle(item, event.target.checked)}
      />
      <span className="ml-2 font-semibold md:sr-only">
        Select<span className="sr-only"> {item.number}</span>
      </span>
    </label>
  );
}

function SelectPageHeader() {
  const { selected, onTogglePage, pageItems } = useBoardSelection();
  const ref = useRef<HTMLInputElement>(null);
  const onPage = pageItems.filter((i) => selected.has(i.id)).length;
  const isAll = pageItems.length > 0 && onPage === pageItems.length;
  useEffect(() => {
    if (ref.current) ref.current.indeterminate = onPage > 0 && !isAll;
  }, [onPage, isAll]);
  return (
    <label className="-m-2 flex min-h-touch min-w-touch cursor-pointer items-center justify-center">
      <input
        ref={ref}
        type="checkbox"
        className="size-6 accent-brand"
        checked={isAll}
        onChange={(event) => onTogglePage(event.target.checked)}
      />
      <span className="sr-only">Select every ticket on this page</span>
    </label>
  );
}

const column = createColumnHelper<WorkOrderListItem>();

function AssigneeName({ item }: { item: WorkOrderListItem }) {
  return item.assignee ? (
    <span>{item.assignee.name}</span>
  ) : (
    <span className="text-ink-muted italic">Unassigned</span>
  );
}

/* Compact columns take only the width they need, so the title gets the rest. */
const tight = 'w-px whitespace-nowrap';

const baseColumns = [
  column.accessor('number', {
    header: 'Ticket',
    cell: (info) => <TicketCell item={info.row.original} />,
    meta: { isCardTitle: true, className: 'min-w-44' },
  }),
  column.display({
    id: 'strings',
    header: 'Strings',
    cell: (info) => <StringsCell item={info.row.original} />,
    meta: { label: 'Strings', className: tight },
  }),
  column.accessor('priority', {
    header: 'Priority',
    cell: (info) => <PriorityBadge priority={info.getValue()} />,
    meta: { label: 'Priority', className: tight },
  }),
  column.accessor('status', {
    // On a wide screen the technician sits under the status: together they say where the ticket is.
    header: () => (
      <>
        Status<span className="sr-only"> and technician</span>
      </>
    ),
    cell: (info) => (
      <span className="flex flex-col items-end gap-1 md:items-start">
        <StatusBadge status={info.getValue()} isInStatusColumn />
        <span className="hidden text-sm md:block">
          <AssigneeName item={info.row.original} />
        </span>
      </span>
    ),
    meta: { label: 'Status', className: tight },
  }),
  column.display({
    id: 'assignee',
    header: 'Technician',
    cell: (info) => <AssigneeName item={info.row.original} />,
    // Phone cards only (the table shows it under the status).
    meta: { label: 'Technician', className: 'hidden' },
  }),
  column.accessor('dueAt', {
    header: 'Deadline',
    cell: (info) => (
      <SlaClock
        dueAt={info.getValue()}
        status={info.row.original.status}
        timeZone={info.row.original.site.timeZone}
        isCompact
      />
    ),
    meta: { label: 'Deadline', className: tight },
  }),
];

const selectColumn = column.display({
  id: 'select',
  header: () => <SelectPageHeader />,
  cell: (info) => <SelectCell item={info.row.original} />,
  meta: { className: 'w-12' },
});

const readerColumns = baseColumns;
const dispatcherColumns = [selectColumn, ...baseColumns];

/** The board: one row per ticket, server-sorted; dispatchers get a checkbox per row for bulk assignment. */
export function WorkOrderTable({
  items,
  sorting,
  onSortingChange,
  isLoading,
  isFetching,
  emptyState,
  selection,
}: {
  items: WorkOrderListItem[];
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  isLoading: boolean;
  isFetching: boolean;
  emptyState: ReactNode;
  /** Absent for roles that may not assign: no checkboxes then. */
  selection?: BoardSelection | undefined;
}) {
  const table = (
    <DataTable
      caption="Work orders"
      columns={selection ? dispatcherColumns : readerColumns}
      data={items}
      getRowId={(item) => String(item.id)}
      sorting={sorting}
      onSortingChange={onSortingChange}
      isLoading={isLoading}
      isFetching={isFetching}
      emptyState={emptyState}
      skeletonRows={8}
    />
  );
  return selection ? <BoardSelectionContext value={selection}>{table}</BoardSelectionContext> : table;
}
