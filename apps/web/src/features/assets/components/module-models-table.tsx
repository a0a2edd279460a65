import type { ModuleModel } from '@stringfield/shared';
import { createColumnHelper } from '@tanstack/react-table';
import { formatNumber, formatQuantity } from '../lib/format';
import { DatasheetTable, datasheetTitleColumn, datasheetTrailingColumns, type DatasheetTableProps } from './datasheet-table';

const column = createColumnHelper<ModuleModel>();

const columns = [
  datasheetTitleColumn(column, 'Module', (m) => (
    <>
      {m.maker} · {m.cellTechnology}
    </>
  )),
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
  ...datasheetTrailingColumns(column, { id: 'stringCount', count: (m) => m.stringCount, one: 'string', many: 'strings' }),
];

export function ModuleModelsTable(props: DatasheetTableProps<ModuleModel>) {
  return <DatasheetTable caption="Module datasheets" columns={columns} {...props} />;
}
