import type { InverterModel } from '@stringfield/shared';
import { createColumnHelper } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { formatNumber, formatPower, formatQuantity } from '../lib/format';
import { LibraryRowActions } from './library-row-actions';

const column = createColumnHelper<InverterModel>();

const columns = [
  column.accessor('model', {
    header: 'Inverter',
    cell: (info) => (
      <div className="min-w-0">
        <span className="font-semibold">{info.getValue()}</span>
        {info.row.original.isArchived ? (
          <Badge tone="neutral" icon="lock" className="ml-2 align-middle">
            Archived
          </Badge>
        ) : null}
        <span className="block text-sm text-ink-muted">{info.row.original.maker}</span>
      </div>
    ),
    meta: { isCardTitle: true },
  }),
  column.display({
    id: 'mppt',
    header: 'MPPT window',
    cell: (info) => (
      <span className="readings whitespace-nowrap">
        {formatNumber(info.row.original.mpptMinV)}–{formatQuantity(info.row.original.mpptMaxV, 'V', 0)}
      </span>
    ),
    meta: { label: 'MPPT window', className: 'md:text-right' },
  }),
  column.accessor('maxDcV', {
    header: 'Max DC',
    cell: (info) => <span className="readings whitespace-nowrap">{formatQuantity(info.getValue(), 'V', 0)}</span>,
    meta: { label: 'Max DC', className: 'md:text-right' },
  }),
  column.display({
    id: 'inputs',
    header: 'Inputs · max A',
    cell: (info) => (
      <span className="readings whitespace-nowrap">
        {info.row.original.mpptInputs} · {formatQuantity(info.row.original.maxInputA, 'A', 0)}
      </span>
    ),
    meta: { label: 'Inputs · max A', className: 'md:text-right' },
  }),
  column.accessor('maxDcW', {
    header: 'Max DC power',
    cell: (info) => <span className="readings whitespace-nowrap">{formatPower(info.getValue())}</span>,
    meta: { label: 'Max DC power', className: 'md:text-right' },
  }),
  column.accessor('inverterCount', {
    header: 'Used by',
    cell: (info) => <span className="readings whitespace-nowrap">{info.getValue()} {info.getValue() === 1 ? 'inverter' : 'inverters'}</span>,
    meta: { label: 'Used by', className: 'md:text-right' },
  }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (info) => <LibraryRowActions item={info.row.original} />,
    meta: { className: 'md:w-px md:whitespace-nowrap' },
  }),
];

export function InverterModelsTable({ models, isLoading, isFetching, emptyState }: { models: InverterModel[]; isLoading: boolean; isFetching: boolean; emptyState: ReactNode }) {
  return (
    <DataTable caption="Inverter datasheets" columns={columns} data={models} getRowId={(m) => String(m.id)} isLoading={isLoading} isFetching={isFetching} emptyState={emptyState} />
  );
}
