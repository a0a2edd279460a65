import type { SizingCheck } from '@stringfield/shared';
import { createColumnHelper } from '@tanstack/react-table';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { formatQuantity } from '../lib/format';

const column = createColumnHelper<SizingCheck>();

const columns = [
  column.accessor('label', {
    header: 'Check',
    enableSorting: false,
    cell: (info) => (
      <div className="min-w-0">
        <span className="font-semibold">{info.getValue()}</span>
        <span className="mt-0.5 block text-sm text-ink-muted">{info.row.original.message}</span>
      </div>
    ),
    meta: { isCardTitle: true, isRowHeader: true, className: 'md:w-1/2' },
  }),
  column.accessor('value', {
    header: 'Value',
    enableSorting: false,
    cell: (info) => <span className="readings whitespace-nowrap">{formatQuantity(info.getValue(), info.row.original.unit)}</span>,
    meta: { label: 'Value', className: 'md:text-right' },
  }),
  column.accessor('limit', {
    header: 'Limit',
    enableSorting: false,
    cell: (info) => <span className="readings whitespace-nowrap">{formatQuantity(info.getValue(), info.row.original.unit)}</span>,
    meta: { label: 'Limit', className: 'md:text-right' },
  }),
  column.accessor('ok', {
    header: 'Verdict',
    enableSorting: false,
    cell: (info) => (info.getValue() ? <Badge tone="pass">Met</Badge> : <Badge tone="fail">Not met</Badge>),
    meta: { label: 'Verdict' },
  }),
];

/** The server's named sizing checks for this string against its inverter input and the site's climate. */
export function SizingChecksTable({ checks }: { checks: SizingCheck[] }) {
  return <DataTable caption="Sizing checks" columns={columns} data={checks} getRowId={(c) => c.code} />;
}
