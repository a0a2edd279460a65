import type { Site } from '@stringfield/shared';
import { createColumnHelper, type OnChangeFn, type SortingState } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { formatNumber } from '../lib/format';

const column = createColumnHelper<Site>();

const columns = [
  column.accessor('name', {
    header: 'Site',
    cell: (info) => (
      <Link
        to={paths.site(info.row.original.id)}
        className="inline-flex min-h-touch flex-col justify-center font-semibold text-brand underline-offset-4 hover:underline"
      >
        {info.getValue()}
        <span className="text-sm font-normal text-ink-muted">{info.row.original.timeZone}</span>
      </Link>
    ),
    meta: { isCardTitle: true },
  }),
  column.accessor('code', {
    header: 'Code',
    cell: (info) => <span className="readings font-mono font-semibold">{info.getValue()}</span>,
    meta: { label: 'Code' },
  }),
  column.accessor('stringCount', {
    header: 'Strings',
    enableSorting: false,
    cell: (info) => <span className="readings">{formatNumber(info.getValue())}</span>,
    meta: { label: 'Strings', className: 'md:text-right' },
  }),
  column.accessor('inverterCount', {
    header: 'Inverters',
    enableSorting: false,
    cell: (info) => <span className="readings">{formatNumber(info.getValue())}</span>,
    meta: { label: 'Inverters', className: 'md:text-right' },
  }),
  column.accessor('sizingFailCount', {
    header: 'Sizing',
    enableSorting: false,
    cell: (info) => {
      const failing = info.getValue();
      if (info.row.original.stringCount === 0) return <Badge tone="neutral" icon={null}>No strings yet</Badge>;
      return failing === 0 ? (
        <Badge tone="pass">All pass</Badge>
      ) : (
        <Link to={paths.site(info.row.original.id, { sizing: 'fail' })} className="inline-flex min-h-touch items-center">
          <Badge tone="fail">
            {failing} {failing === 1 ? 'string fails' : 'strings fail'}
          </Badge>
        </Link>
      );
    },
    meta: { label: 'Sizing' },
  }),
];

export function SitesTable({
  sites,
  sorting,
  onSortingChange,
  isLoading,
  isFetching,
  emptyState,
}: {
  sites: Site[];
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  isLoading: boolean;
  isFetching: boolean;
  emptyState: ReactNode;
}) {
  return (
    <DataTable
      caption="Sites"
      columns={columns}
      data={sites}
      getRowId={(site) => String(site.id)}
      sorting={sorting}
      onSortingChange={onSortingChange}
      isLoading={isLoading}
      isFetching={isFetching}
      emptyState={emptyState}
    />
  );
}
