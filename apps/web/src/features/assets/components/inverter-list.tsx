import type { Inverter } from '@stringfield/shared';
import { Link } from 'react-router';
import { cn } from '@/lib/cn';

/** The site's inverters as filter links: each shows its model, inputs and string count. */
export function InverterList({ inverters, selectedId, hrefFor }: { inverters: readonly Inverter[]; selectedId: number | undefined; hrefFor: (inverterId: number | undefined) => string }) {
  if (inverters.length === 0) return <p className="text-ink-muted">No inverters registered yet. A layout import adds strings to existing inverters.</p>;
  return (
    <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-5">
      {inverters.map((inverter) => {
        const isSelected = inverter.id === selectedId;
        return (
          <li key={inverter.id}>
            <Link
              to={hrefFor(isSelected ? undefined : inverter.id)}
              aria-current={isSelected ? 'true' : undefined}
              preventScrollReset
              className={cn(
                'flex min-h-touch flex-col rounded-control border-2 px-3 py-2 transition-colors',
                isSelected ? 'border-brand bg-brand-soft' : 'border-line bg-surface hover:border-edge',
              )}
            >
              <span className="readings font-mono font-semibold text-ink">{inverter.tag}</span>
              <span className="text-sm text-ink-muted">
                {inverter.mpptInputs} inputs · {inverter.stringCount} strings
              </span>
              <span className="sr-only">{isSelected ? ', showing only its strings; press to show all' : ', show only its strings'}</span>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
