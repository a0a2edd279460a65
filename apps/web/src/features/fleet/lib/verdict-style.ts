import type { HealthCell } from '@stringfield/shared';

/** A string's latest verdict, with `unchecked` for a string that has no current check. */
export type CellVerdict = NonNullable<HealthCell['verdict']> | 'unchecked';

export const cellVerdicts: readonly CellVerdict[] = ['fail', 'attention', 'pass', 'unchecked'];

export type VerdictStyle = {
  /** The word a person reads; never only the colour. */
  label: string;
  /** The glyph drawn in the cell (empty for pass and unchecked, whose fill and outline differ). */
  glyph: string;
  /** The fill pattern, named so the legend can say it in words. */
  pattern: 'solid' | 'striped' | 'cross-hatched' | 'outline';
  /** The CSS class in health-map.css that paints the colour and pattern. */
  className: string;
  /** Lower sorts first: the list view puts the worst strings at the top. */
  severity: number;
};

/* Colour is one of four cues: fill pattern, glyph, the word in the legend and tooltip, and the
   accessible name of every cell. Anyone who cannot tell green from red still reads ✕ on hatching. */
export const verdictStyles: Record<CellVerdict, VerdictStyle> = {
  fail: { label: 'Fail', glyph: '✕', pattern: 'cross-hatched', className: 'sf-cell--fail', severity: 0 },
  attention: { label: 'Needs attention', glyph: '!', pattern: 'striped', className: 'sf-cell--attention', severity: 1 },
  pass: { label: 'Pass', glyph: '', pattern: 'solid', className: 'sf-cell--pass', severity: 3 },
  unchecked: { label: 'Not checked', glyph: '', pattern: 'outline', className: 'sf-cell--unchecked', severity: 2 },
};

export function cellVerdict(cell: Pick<HealthCell, 'verdict'>): CellVerdict {
  return cell.verdict ?? 'unchecked';
}

const percent = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1, signDisplay: 'exceptZero' });
const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** `-12.34` → "−12.3 %" (a true minus sign, so it reads as negative at a glance); null → "–". */
export function formatDeviation(pct: number | null): string {
  if (pct === null || !Number.isFinite(pct)) return '–';
  return `${percent.format(pct).replace('-', '−')} %`;
}

/** An ISO time as "3 Nov 2026" (UTC, so everyone in a crew reads the same day). */
export function formatCheckDay(iso: string | null): string {
  if (!iso) return 'never';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : day.format(d);
}

/** The facts of one cell as the lines of its tooltip and list row. */
export function cellFacts(cell: HealthCell): { verdict: string; deviations: string; checked: string; tickets: string } {
  const verdict = verdictStyles[cellVerdict(cell)].label;
  const hasCheck = cell.checkedAt !== null;
  return {
    verdict,
    deviations: hasCheck ? `Voc ${formatDeviation(cell.vocDeviationPct)} · Isc ${formatDeviation(cell.iscDeviationPct)}` : 'No current check',
    checked: hasCheck ? `Checked ${formatCheckDay(cell.checkedAt)}` : 'Never checked',
    tickets: cell.openTickets === 0 ? 'No open ticket' : cell.openTickets === 1 ? '1 open ticket' : `${cell.openTickets} open tickets`,
  };
}

/**
 * What a screen reader says for a cell: label, verdict, deviations, when, tickets. The map's
 * tooltip shows the same facts to sighted people, so nothing lives only on hover.
 */
export function cellAccessibleName(cell: HealthCell): string {
  const f = cellFacts(cell);
  return `${cell.label}: ${f.verdict}. ${f.deviations}. ${f.checked}. ${f.tickets}.`;
}
