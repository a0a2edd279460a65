import type { PvString } from '@stringfield/shared';
import { createColumnHelper, type OnChangeFn, type SortingState } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { SizingBadge } from './sizing-badge';

const column = createColumnHelper<PvString>();

const columns = [
  column.accessor('label', {
    header: 'String',
    cell: (info) => (
      <Link
        to={paths.string(info.row.original.id)}
        className="readings inline-flex min-h-touch items-center font-mono font-semibold whitespace-nowrap text-brand underline-offset-4 hover:underline"
      >
        {info.getValue()}
      </Link>
    ),
    meta: { isCardTitle: true },
  }),
  column.accessor('inverterTag', {
    id: 'inverter',
    header: 'Inverter · input',
    cell: (info) => (
      <span className="readings whitespace-nowrap">
        {info.getValue()} · MPPT {info.row.original.mpptInput}
      </span>
    ),
    meta: { label: 'Inverter · input' },
  }),
  column.accessor('combinerTag', {
    header: 'Combiner',
    enableSorting: false,
    cell: (info) => {
      const tag = info.getValue();
      if (!tag) return <span className="text-ink-muted">Direct</span>;
      const position = info.row.original.combinerPosition;
      return (
        <span className="readings whitespace-nowrap">
          {tag}
          {position ? ` · pos ${position}` : ''}
        </span>
      );
    },
    meta: { label: 'Combiner' },
  }),
  column.accessor('modulesInSeries', {
    header: 'Modules',
    cell: (info) => (
      <span className="readings whitespace-nowrap">
        {info.getValue()} × {info.row.original.moduleModel}
        {info.row.original.stringsInParallel > 1 ? <span className="block text-sm text-ink-muted">{info.row.original.stringsInParallel} strings on the input</span> : null}
      </span>
    ),
    meta: { label: 'Modules' },
  }),
  column.accessor('sizingFailures', {
    header: 'Sizing',
    enableSorting: false,
    cell: (info) => <SizingBadge failures={info.getValue()} />,
    meta: { label: 'Sizing' },
  }),
];

export function StringsTable({
  strings,
  sorting,
  onSortingChange,
  isLoading,
  isFetching,
  emptyState,
  caption,
}: {
  strings: PvString[];
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  isLoading: boolean;
  isFetching: boolean;
  emptyState: ReactNode;
  caption: string;
}) {
  return (
    <DataTable
      caption={caption}
      columns={columns}
      data={strings}
      getRowId={(s) => String(s.id)}
      sorting={sorting}
      onSortingChange={onSortingChange}
      isLoading={isLoading}
      isFetching={isFetching}
      emptyState={emptyState}
      skeletonRows={8}
    />
  );
}
