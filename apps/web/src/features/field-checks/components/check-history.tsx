import type { StringCheck } from '@stringfield/shared';
import { cn } from '@/lib/cn';
import { formatNumber, formatTakenAt } from '../lib/format';
import { VerdictBadge } from './verdict-badge';

/** Every reading of one string on this ticket, newest first; corrected readings greyed and marked. */
export function CheckHistory({ checks }: { checks: readonly StringCheck[] }) {
  if (checks.length === 0) return null;
  const ordered = [...checks].sort((a, b) => Date.parse(b.takenAt) - Date.parse(a.takenAt) || b.id - a.id);
  return (
    <section aria-labelledby="check-history-title" className="flex flex-col gap-2">
      <h3 id="check-history-title" className="text-lg font-bold">
        History on this ticket
      </h3>
      <ol className="flex flex-col gap-2">
        {ordered.map((c) => {
          const isSuperseded = c.supersededById !== null;
          return (
            <li
              key={c.id}
              className={cn('flex flex-wrap items-center justify-between gap-2 rounded-control border border-line p-3', isSuperseded ? 'bg-sunken text-ink-faint' : 'bg-surface')}
            >
              <div className="min-w-0">
                <p className={cn('readings font-semibold', isSuperseded && 'line-through decoration-2')}>
                  Voc {formatNumber(c.vocV, 1)} V{c.iscA !== null ? ` · Isc ${formatNumber(c.iscA, 2)} A` : ''}
                </p>
                <p className="text-sm">
                  {c.phase === 'before' ? 'Before' : 'After'} · {formatTakenAt(c.takenAt)}
                  {isSuperseded ? ' · corrected, replaced by a later revision' : c.supersedesId !== null ? ' · correction' : ''}
                </p>
              </div>
              {isSuperseded ? <span className="text-sm font-semibold">Superseded</span> : <VerdictBadge verdict={c.verdict} />}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
