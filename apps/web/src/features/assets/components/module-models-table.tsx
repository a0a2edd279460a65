import type { ModuleModel } from '@stringfield/shared';
import { createColumnHelper } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { formatNumber, formatQuantity } from '../lib/format';
import { LibraryRowActions } from './library-row-actions';

const column = createColumnHelper<ModuleModel>();

const columns = [
  column.accessor('model', {
    header: 'Module',
    cell: (info) => (
      <div className="min-w-0">
        <span className="font-semibold">{info.getValue()}</span>
        {info.row.original.isArchived ? (
          <Badge tone="neutral" icon="lock" className="ml-2 align-middle">
            Archived
          </Badge>
        ) : null}
        <span className="block text-sm text-ink-muted">
          {info.row.original.maker} · {info.row.original.cellTechnology}
        </span>
      </div>
    ),
    meta: { isCardTitle: true },
  }),
  column.accessor('pmaxW', {
    header: 'Pmax',
    cell: (info) => <span className="readings whitespace-nowrap">{formatQuantity(info.getValue(), 'W', 0)}</span>,
    meta: { label: 'Pmax', className: 'md:text-right' },
  }),
  column.display({
    id: 'voc-isc',
    header: 'Voc · Isc',
    cell: (info) => (
      <span className="readings whitespace-nowrap">
        {formatQuantity(info.row.original.vocV, 'V', 2)} · {formatQuantity(info.row.original.iscA, 'A')}
      </span>
    ),
    meta: { label: 'Voc · Isc', className: 'md:text-right' },
  }),
  column.accessor('betaVocPctPerC', {
    header: 'β Voc',
    cell: (info) => <span className="readings whitespace-nowrap">{formatNumber(info.getValue(), 3)} %/°C</span>,
    meta: { label: 'β Voc', className: 'md:text-right' },
  }),
  column.display({
    id: 'cells',
    header: 'Cells · diodes',
    cell: (info) => (
      <span className="readings">
        {info.row.original.cellsInSeries} · {info.row.original.bypassDiodes}
      </span>
    ),
    meta: { label: 'Cells · diodes', className: 'md:text-right' },
  }),
  column.accessor('stringCount', {
    header: 'Used by',
    cell: (info) => <span className="readings whitespace-nowrap">{info.getValue()} {info.getValue() === 1 ? 'string' : 'strings'}</span>,
    meta: { label: 'Used by', className: 'md:text-right' },
  }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (info) => <LibraryRowActions item={info.row.original} />,
    meta: { className: 'md:w-px md:whitespace-nowrap' },
  }),
];

export function ModuleModelsTable({ models, isLoading, isFetching, emptyState }: { models: ModuleModel[]; isLoading: boolean; isFetching: boolean; emptyState: ReactNode }) {
  return (
    <DataTable caption="Module datasheets" columns={columns} data={models} getRowId={(m) => String(m.id)} isLoading={isLoading} isFetching={isFetching} emptyState={emptyState} />
  );
}
