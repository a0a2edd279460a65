import type { ColumnDef, ColumnHelper } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { LibraryRowActions } from './library-row-actions';

/** What every datasheet row has, whatever its kind. */
export type DatasheetRow = { id: number; maker: string; model: string; isArchived: boolean };

/** The title column: model in bold, an "Archived" badge, and a subtitle (the maker, maybe more). */
export function datasheetTitleColumn<T extends DatasheetRow>(column: ColumnHelper<T>, header: string, subtitle: (row: T) => ReactNode) {
  return column.accessor((row) => row.model, {
    id: 'model',
    header,
    cell: (info) => (
      <div className="min-w-0">
        <span className="font-semibold whitespace-nowrap">{info.getValue()}</span>
        {info.row.original.isArchived ? (
          <Badge tone="neutral" icon="lock" className="ml-2 align-middle">
            Archived
          </Badge>
        ) : null}
        <span className="block text-sm text-ink-muted">{subtitle(info.row.original)}</span>
      </div>
    ),
    // The column people read first: wide enough on a desktop that the model and its maker do not wrap.
    meta: { isCardTitle: true, className: 'md:min-w-48' },
  });
}

/** "Used by N strings/inverters", and the row's edit/archive/delete buttons. */
export function datasheetTrailingColumns<T extends DatasheetRow>(
  column: ColumnHelper<T>,
  usedBy: { id: string; count: (row: T) => number; one: string; many: string },
) {
  return [
    column.accessor(usedBy.count, {
      id: usedBy.id,
      header: 'Used by',
      cell: (info) => <span className="readings whitespace-nowrap">{info.getValue()} {info.getValue() === 1 ? usedBy.one : usedBy.many}</span>,
      meta: { label: 'Used by', className: 'md:text-right' },
    }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => <LibraryRowActions item={info.row.original} isInUse={usedBy.count(info.row.original) > 0} />,
      meta: { className: 'md:w-px md:whitespace-nowrap' },
    }),
  ];
}

export type DatasheetTableProps<T> = { models: T[]; isLoading: boolean; isFetching: boolean; emptyState: ReactNode };

export function DatasheetTable<T extends DatasheetRow>({
  caption,
  columns,
  models,
  isLoading,
  isFetching,
  emptyState,
}: DatasheetTableProps<T> & {
  caption: string;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- TanStack column value types vary per column
  columns: ColumnDef<T, any>[];
}) {
  return <DataTable caption={caption} columns={columns} data={models} getRowId={(m) => String(m.id)} isLoading={isLoading} isFetching={isFetching} emptyState={emptyState} />;
}
