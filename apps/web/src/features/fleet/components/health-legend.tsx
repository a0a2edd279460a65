import type { HealthMap } from '@stringfield/shared';
import { cn } from '@/lib/cn';
import { cellVerdicts, verdictStyles, type CellVerdict } from '../lib/verdict-style';
import './health-map.css';

const patternWords: Record<CellVerdict, string> = {
  fail: 'cross-hatched, ✕',
  attention: 'striped, !',
  pass: 'solid',
  unchecked: 'hollow outline',
};

/** A cell's look at legend size, decorative: the words beside it carry the meaning. */
export function VerdictSwatch({ verdict, hasTicket = false, className }: { verdict: CellVerdict; hasTicket?: boolean; className?: string }) {
  const style = verdictStyles[verdict];
  return (
    <span aria-hidden="true" className={cn('sf-cell sf-swatch', style.className, hasTicket && 'sf-cell--ticket', className)}>
      {style.glyph ? <span>{style.glyph}</span> : null}
    </span>
  );
}

/**
 * The key to the map, with counts, doubling as the verdict filter: pressing "Fail 3" lights only
 * the failed strings; pressing it again shows all. The open-ticket dot toggles its own filter.
 */
export function HealthLegend({
  counts,
  verdict,
  isOpenOnly,
  onVerdictChange,
  onOpenOnlyChange,
}: {
  counts: HealthMap['counts'];
  verdict: CellVerdict | undefined;
  isOpenOnly: boolean;
  onVerdictChange: (verdict: CellVerdict | undefined) => void;
  onOpenOnlyChange: (isOpenOnly: boolean) => void;
}) {
  const item = (isPressed: boolean) =>
    cn(
      'inline-flex min-h-touch items-center gap-2.5 rounded-control border-2 px-3 text-left font-semibold transition-colors',
      isPressed ? 'border-brand bg-brand-soft text-ink' : 'border-line bg-surface text-ink hover:border-edge',
    );
  return (
    <div role="group" aria-label="Legend and verdict filter" className="grid grid-cols-2 gap-2 sm:flex sm:flex-wrap">
      {cellVerdicts.map((v) => (
        <button key={v} type="button" aria-pressed={verdict === v} className={item(verdict === v)} onClick={() => onVerdictChange(verdict === v ? undefined : v)}>
          <VerdictSwatch verdict={v} />
          <span>
            {verdictStyles[v].label} <span className="readings font-bold">{counts[v].toLocaleString('en')}</span>
            <span className="block text-xs font-normal text-ink-muted">{patternWords[v]}</span>
          </span>
        </button>
      ))}
      <button type="button" aria-pressed={isOpenOnly} className={item(isOpenOnly)} onClick={() => onOpenOnlyChange(!isOpenOnly)}>
        <VerdictSwatch verdict="unchecked" hasTicket className="mr-0.5" />
        <span>
          Open ticket <span className="readings font-bold">{counts.withOpenTickets.toLocaleString('en')}</span>
          <span className="block text-xs font-normal text-ink-muted">dot at the corner</span>
        </span>
      </button>
    </div>
  );
}
