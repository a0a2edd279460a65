import type { EnergyAtRiskItem } from '@stringfield/shared';
import { createColumnHelper, type OnChangeFn, type SortingState } from '@tanstack/react-table';
import { createContext, use, type ReactNode } from 'react';
import { Link } from 'react-router';
import { DataTable } from '@/components/ui/data-table';
import { formatKWhPerDay, formatNumber, formatPower } from '../lib/format';

type TicketLinks = { ticketHref: ((workOrderId: number) => string) | null };
const TicketLinksContext = createContext<TicketLinks>({ ticketHref: null });

function TicketCell({ item }: { item: EnergyAtRiskItem }) {
  const { ticketHref } = use(TicketLinksContext);
  const number = <span className="readings font-mono font-semibold whitespace-nowrap">{item.number}</span>;
  return (
    <div>
      {ticketHref ? (
        <Link to={ticketHref(item.workOrderId)} className="inline-flex min-h-touch items-center text-brand underline underline-offset-2 md:min-h-0">
          {number}
        </Link>
      ) : (
        number
      )}
      <span className="block text-sm text-ink-muted">{item.siteCode}</span>
    </div>
  );
}

const column = createColumnHelper<EnergyAtRiskItem>();

const columns = [
  column.accessor('number', { header: 'Ticket', cell: (info) => <TicketCell item={info.row.original} />, meta: { isCardTitle: true } }),
  column.accessor('missingW', {
    header: 'Missing power',
    cell: (info) => <span className="readings font-semibold">{formatPower(info.getValue())}</span>,
    meta: { label: 'Missing power', className: 'text-right md:text-right' },
  }),
  column.accessor('dailyKWh', {
    header: 'Energy per day (est.)',
    cell: (info) => <span className="readings">≈ {formatKWhPerDay(info.getValue())}</span>,
    meta: { label: 'Energy per day (est.)', className: 'md:text-right' },
  }),
  column.accessor('peakSunHours', {
    header: 'Peak sun hours',
    enableSorting: false,
    cell: (info) => <span className="readings">{formatNumber(info.getValue(), 1)} h/day</span>,
    meta: { label: 'Peak sun hours', className: 'md:text-right' },
  }),
  column.accessor('basis', { header: 'Basis', enableSorting: false, cell: (info) => <span className="text-sm text-ink-muted">{info.getValue()}</span>, meta: { label: 'Basis' } }),
];

/** Open tickets by the power their strings are missing: an estimate, as the page around it says. */
export function EnergyTable({
  items,
  sorting,
  onSortingChange,
  ticketHref,
  isLoading,
  emptyState,
  caption,
}: {
  items: EnergyAtRiskItem[];
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  /** Null when the person may not open open tickets (an asset owner sees signed-off work only). */
  ticketHref: ((workOrderId: number) => string) | null;
  isLoading: boolean;
  emptyState: ReactNode;
  caption: string;
}) {
  return (
    <TicketLinksContext value={{ ticketHref }}>
      <DataTable
        columns={columns}
        data={items}
        caption={caption}
        getRowId={(i) => String(i.workOrderId)}
        sorting={sorting}
        onSortingChange={onSortingChange}
        isLoading={isLoading}
        emptyState={emptyState}
        skeletonRows={4}
      />
    </TicketLinksContext>
  );
}
