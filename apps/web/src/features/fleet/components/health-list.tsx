import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { bySeverity, type GridLayout } from '../lib/health-grid';
import { matchesCell, type MapParams } from '../lib/map-params';
import { cellFacts, cellVerdict } from '../lib/verdict-style';
import { VerdictSwatch } from './health-legend';

const pageSize = 100;

/**
 * The map as a list, for phones, screen readers and gloved fingers: the matching strings worst
 * first, one 48 px row each, a hundred at a time.
 */
export function HealthList({ layout, filters, hrefFor }: { layout: GridLayout; filters: Pick<MapParams, 'verdict' | 'isOpenOnly' | 'inverter'>; hrefFor: (stringId: number) => string }) {
  const { verdict, isOpenOnly, inverter } = filters;
  const items = useMemo(() => {
    const rows = inverter ? layout.rows.filter((r) => r.inverterTag === inverter) : layout.rows;
    return rows.flatMap((r) => r.cells.filter((p) => matchesCell(p.cell, { verdict, isOpenOnly }))).sort(bySeverity);
  }, [layout, verdict, isOpenOnly, inverter]);
  const [shown, setShown] = useState(pageSize);
  const visible = items.slice(0, shown);

  return (
    <div>
      <p className="mb-2 text-sm text-ink-muted" aria-live="polite">
        {items.length.toLocaleString('en')} {items.length === 1 ? 'string' : 'strings'}, worst first
        {items.length > visible.length ? ` · showing ${visible.length.toLocaleString('en')}` : ''}
      </p>
      <ul className="divide-y divide-line overflow-hidden rounded-card border border-line bg-surface shadow-card">
        {visible.map(({ cell }) => {
          const facts = cellFacts(cell);
          return (
            <li key={cell.stringId}>
              <Link to={hrefFor(cell.stringId)} className="flex min-h-touch items-center gap-3 px-3 py-2 hover:bg-paper">
                <VerdictSwatch verdict={cellVerdict(cell)} hasTicket={cell.openTickets > 0} />
                <span className="min-w-0 flex-1">
                  <span className="block font-mono font-semibold [overflow-wrap:anywhere] text-ink">{cell.label}</span>
                  <span className="block text-sm text-ink-muted">
                    <span className="font-semibold text-ink">{facts.verdict}</span> · <span className="readings">{facts.deviations}</span> · {facts.checked}
                  </span>
                </span>
                {cell.openTickets > 0 ? (
                  <Badge tone="brand" icon="clipboard">
                    {facts.tickets}
                  </Badge>
                ) : null}
              </Link>
            </li>
          );
        })}
      </ul>
      {items.length > visible.length ? (
        <Button className="mt-3" onClick={() => setShown((n) => n + pageSize)}>
          Show {Math.min(pageSize, items.length - visible.length)} more
        </Button>
      ) : null}
    </div>
  );
}
