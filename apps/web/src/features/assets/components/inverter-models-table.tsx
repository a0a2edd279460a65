import type { InverterModel } from '@stringfield/shared';
import { createColumnHelper } from '@tanstack/react-table';
import { formatNumber, formatPower, formatQuantity } from '../lib/format';
import { DatasheetTable, datasheetTitleColumn, datasheetTrailingColumns, type DatasheetTableProps } from './datasheet-table';

const column = createColumnHelper<InverterModel>();

const columns = [
  datasheetTitleColumn(column, 'Inverter', (m) => m.maker),
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
  ...datasheetTrailingColumns(column, { id: 'inverterCount', count: (m) => m.inverterCount, one: 'inverter', many: 'inverters' }),
];

export function InverterModelsTable(props: DatasheetTableProps<InverterModel>) {
  return <DatasheetTable caption="Inverter datasheets" columns={columns} {...props} />;
}
