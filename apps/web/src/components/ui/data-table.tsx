import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type OnChangeFn,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { useLayoutEffect, useRef, type FocusEvent, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { useAfterDelay } from '@/lib/use-after-delay';
import { useMediaQuery } from '@/lib/use-media-query';
import { Icon } from './icon';
import { LoadingRegion, Skeleton } from './skeleton';

declare module '@tanstack/react-table' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- the generics must match TanStack's declaration to merge
  interface ColumnMeta<TData extends RowData, TValue> {
    /** The column's name as words, used as the label on the phone card layout. */
    label?: string;
    /** Extra classes for the header and body cells of this column. */
    className?: string;
    /** Leave this column's label off the phone card (e.g. the title line or an actions column). */
    isCardTitle?: boolean;
    /** This column names the row (a `<th scope="row">`), so each cell is read with its row's name. */
    isRowHeader?: boolean;
  }
}

type DataTableProps<T> = {
  /** Column definitions, made once at module scope with createColumnHelper. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- TanStack column value types vary per column
  columns: ColumnDef<T, any>[];
  data: T[];
  /** Names the table for screen readers. */
  caption: string;
  getRowId: (row: T) => string;
  /** Server-side sorting: the table only shows and reports it. */
  sorting?: SortingState;
  onSortingChange?: OnChangeFn<SortingState>;
  isLoading?: boolean;
  /** Greys the rows while a new page or sort order is on its way. */
  isFetching?: boolean;
  emptyState?: ReactNode;
  skeletonRows?: number;
};

/**
 * The one generic table. Sorting and paging are the server's job (manual mode) so the state can live
 * in the URL. Below 768 px each row becomes a card of label/value pairs, readable on a phone without
 * sideways scrolling. Only the layout on screen is rendered (drawing both and letting CSS hide one
 * doubles the DOM a phone builds for its first page); it switches when the window crosses 768 px.
 * Focus survives the switch: the same control of the same row is focused in the new layout.
 */
export function DataTable<T>({
  columns,
  data,
  caption,
  getRowId,
  sorting = [],
  onSortingChange,
  isLoading = false,
  isFetching = false,
  emptyState,
  skeletonRows = 6,
}: DataTableProps<T>) {
  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table returns a mutable instance; this component is not compiler-memoized
  const table = useReactTable({
    data,
    columns,
    getRowId: (row) => getRowId(row),
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
    state: { sorting },
    onSortingChange,
  });
  const isTable = useMediaQuery(tableQuery);
  const { containerRef, onFocus, onBlur } = useFocusAcrossLayouts(isTable);
  const isSlow = useAfterDelay(isLoading, SKELETON_DELAY_MS);

  if (isLoading && !isSlow) {
    // Said to screen readers at once; drawn only if the answer takes a while (see SKELETON_DELAY_MS).
    return <LoadingRegion label={`Loading ${caption.toLowerCase()}`} className="min-h-64">{null}</LoadingRegion>;
  }

  if (isLoading) {
    return (
      <LoadingRegion label={`Loading ${caption.toLowerCase()}`} className="overflow-hidden rounded-card border border-line bg-surface">
        <div className="hidden gap-4 border-b border-line bg-sunken px-4 py-3 md:flex">
          {columns.map((_, index) => (
            <Skeleton key={index} className="h-5 flex-1" />
          ))}
        </div>
        {Array.from({ length: skeletonRows }, (_, index) => (
          <div key={index} className="flex flex-col gap-2 border-b border-line px-4 py-4 last:border-b-0 md:flex-row md:gap-4">
            {columns.map((__, cell) => (
              <Skeleton key={cell} className={cn('h-5 md:flex-1', cell === 0 ? 'w-1/2' : 'w-1/3 md:w-auto')} />
            ))}
          </div>
        ))}
      </LoadingRegion>
    );
  }

  if (data.length === 0 && emptyState) return <>{emptyState}</>;

  const rows = table.getRowModel().rows;

  return (
    <div
      ref={containerRef}
      // Only a fallback target for focus after a layout switch (see useFocusAcrossLayouts), never a tab stop.
      tabIndex={-1}
      onFocus={onFocus}
      onBlur={onBlur}
      aria-busy={isFetching || undefined}
      className={cn('transition-opacity outline-none', isFetching && 'opacity-60')}
    >
      {isTable ? (
        /* Desktop and tablet: a real table. */
        <div className="overflow-x-auto rounded-card border border-line bg-surface shadow-card">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">{caption}</caption>
            <thead className="bg-sunken">
              {table.getHeaderGroups().map((headerGroup) => (
                <tr key={headerGroup.id}>
                  {headerGroup.headers.map((header) => {
                    const sorted = header.column.getIsSorted();
                    const canSort = header.column.getCanSort() && Boolean(onSortingChange);
                    const label = flexRender(header.column.columnDef.header, header.getContext());
                    return (
                      <th
                        key={header.id}
                        scope="col"
                        aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                        className={cn('border-b-2 border-edge/50 px-3 py-2 text-sm font-semibold text-ink-muted', header.column.columnDef.meta?.className)}
                      >
                        {header.isPlaceholder ? null : canSort ? (
                          <button
                            type="button"
                            onClick={header.column.getToggleSortingHandler()}
                            className="-mx-2 inline-flex min-h-touch items-center gap-1.5 rounded-control px-2 hover:bg-paper hover:text-ink"
                          >
                            {label}
                            <Icon
                              name={sorted === 'asc' ? 'chevronUp' : sorted === 'desc' ? 'chevronDown' : 'sort'}
                              className={cn('size-4', !sorted && 'opacity-60')}
                            />
                            {/* Rely on aria-sort for the state; this tells what a press will do. */}
                            <span className="sr-only">{sorted === 'asc' ? ', sort descending' : ', sort ascending'}</span>
                          </button>
                        ) : (
                          label
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.id} data-row-id={row.id} className="border-b border-line last:border-b-0 hover:bg-paper/70">
                  {row.getVisibleCells().map((cell) =>
                    cell.column.columnDef.meta?.isRowHeader ? (
                      <th key={cell.id} data-column-id={cell.column.id} scope="row" className={cn('px-3 py-3 align-middle font-normal', cell.column.columnDef.meta.className)}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </th>
                    ) : (
                      <td key={cell.id} data-column-id={cell.column.id} className={cn('px-3 py-3 align-middle', cell.column.columnDef.meta?.className)}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ),
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        /* Phone: one card per row. */
        <ul aria-label={caption} className="flex flex-col gap-3">
          {rows.map((row) => {
            const cells = row.getVisibleCells();
            const render = (cell: (typeof cells)[number]) => flexRender(cell.column.columnDef.cell, cell.getContext());
            const titleCells = cells.filter((cell) => cell.column.columnDef.meta?.isCardTitle);
            const labelledCells = cells.filter((cell) => !cell.column.columnDef.meta?.isCardTitle && cell.column.columnDef.meta?.label);
            const restCells = cells.filter((cell) => !cell.column.columnDef.meta?.isCardTitle && !cell.column.columnDef.meta?.label);
            return (
              <li key={row.id} data-row-id={row.id} className="flex flex-col gap-3 rounded-card border border-line bg-surface p-4 shadow-card">
                {titleCells.map((cell) => (
                  <div key={cell.id} data-column-id={cell.column.id}>
                    {render(cell)}
                  </div>
                ))}
                {labelledCells.length > 0 ? (
                  <dl className="flex flex-col gap-2">
                    {labelledCells.map((cell) => (
                      <div key={cell.id} className="flex items-baseline justify-between gap-4">
                        <dt className="text-sm text-ink-muted">{cell.column.columnDef.meta?.label}</dt>
                        <dd data-column-id={cell.column.id} className="text-right">
                          {render(cell)}
                        </dd>
                      </div>
                    ))}
                  </dl>
                ) : null}
                {restCells.map((cell) => (
                  <div key={cell.id} data-column-id={cell.column.id}>
                    {render(cell)}
                  </div>
                ))}
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}

/** Tailwind's `md:` breakpoint, from which rows are a table rather than cards. */
const tableQuery = '(min-width: 48rem)';
/**
 * How long a list may be loading before its skeleton rows are drawn. Most answers come sooner, and then
 * the rows appear in one step: drawing dozens of placeholders (63 on the board's cards, each starting an
 * animation) and replacing them a moment later costs a phone a layout of the page for no information.
 */
const SKELETON_DELAY_MS = 300;

/** Where focus was inside the table: the element itself, and how to find its twin in the other layout. */
type FocusSpot = {
  element: Element;
  rowId: string | null;
  columnId: string | null;
  /** Its position among the focusable elements of its cell (or of its row, without a cell). */
  index: number;
};

const focusableSelector = 'a[href], button, input, select, textarea, [tabindex]:not([tabindex="-1"])';

function focusablesIn(scope: Element): HTMLElement[] {
  return [...scope.querySelectorAll<HTMLElement>(focusableSelector)].filter((el) => !el.matches(':disabled'));
}

function spotOf(element: Element, container: Element): FocusSpot {
  const row = element.closest('[data-row-id]');
  const cell = element.closest('[data-column-id]');
  const scope = (row && container.contains(row) ? cell ?? row : null) ?? container;
  return {
    element,
    rowId: row && container.contains(row) ? row.getAttribute('data-row-id') : null,
    columnId: cell && row?.contains(cell) ? cell.getAttribute('data-column-id') : null,
    index: focusablesIn(scope).indexOf(element as HTMLElement),
  };
}

/** Focuses `el` if it can take focus (a control hidden in this layout cannot); says whether it did. */
function tryFocus(el: HTMLElement | null | undefined): boolean {
  if (!el) return false;
  el.focus();
  return document.activeElement === el;
}

/** The matching control in the layout now on screen: same row and cell, else the row's first control. */
function restoreFocus(container: HTMLElement, spot: FocusSpot) {
  const row = spot.rowId === null ? null : [...container.querySelectorAll('[data-row-id]')].find((r) => r.getAttribute('data-row-id') === spot.rowId);
  if (row) {
    const cell = spot.columnId === null ? null : [...row.querySelectorAll('[data-column-id]')].find((c) => c.getAttribute('data-column-id') === spot.columnId);
    const inCell = cell ? focusablesIn(cell) : [];
    if (tryFocus(inCell[spot.index]) || inCell.some(tryFocus)) return;
    if (focusablesIn(row).some(tryFocus)) return;
  }
  container.focus({ preventScroll: true });
}

/**
 * The two layouts share no DOM, so crossing 768 px (turning a tablet, resizing a window, zooming)
 * removes the focused control and the browser drops focus to the page's start. This remembers where
 * focus was in the table and, right after the switch, focuses the same row's same control in the new
 * layout (or the table itself when that control has no twin, e.g. a column's sort button).
 */
function useFocusAcrossLayouts(isTable: boolean) {
  const containerRef = useRef<HTMLDivElement>(null);
  const spot = useRef<FocusSpot | null>(null);
  const shownLayout = useRef(isTable);

  const onFocus = (event: FocusEvent<HTMLDivElement>) => {
    spot.current = event.target === event.currentTarget ? null : spotOf(event.target, event.currentTarget);
  };
  const onBlur = (event: FocusEvent<HTMLDivElement>) => {
    if (event.relatedTarget && event.currentTarget.contains(event.relatedTarget)) return;
    // A blur because the element was removed (the layout switch) keeps the spot; a real blur (focus
    // moved elsewhere, or a click on the page) forgets it. Only after the commit can they be told apart.
    const left = spot.current;
    queueMicrotask(() => {
      if (spot.current === left && left?.element.isConnected) spot.current = null;
    });
  };

  useLayoutEffect(() => {
    if (shownLayout.current === isTable) return;
    shownLayout.current = isTable;
    const container = containerRef.current;
    const last = spot.current;
    spot.current = null;
    if (!container || !last || last.element.isConnected) return;
    // Only when focus was really lost with the old layout, not taken by something else meanwhile.
    if (document.activeElement && document.activeElement !== document.body && document.activeElement !== container) return;
    restoreFocus(container, last);
  }, [isTable]);

  return { containerRef, onFocus, onBlur };
}
