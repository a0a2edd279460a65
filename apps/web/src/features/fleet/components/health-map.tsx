import type { HealthCell } from '@stringfield/shared';
import { memo, useCallback, useDeferredValue, useId, useMemo, useRef, useState, type FocusEvent, type KeyboardEvent, type MouseEvent, type PointerEvent } from 'react';
import { cn } from '@/lib/cn';
import { moveForKey, moveInGrid, type GridLayout, type GridRow } from '../lib/health-grid';
import { hasCellFilter, matchesCell, type MapParams } from '../lib/map-params';
import { cellAccessibleName, cellFacts, cellVerdict, verdictStyles } from '../lib/verdict-style';
import './health-map.css';

type CellFilter = Pick<MapParams, 'verdict' | 'isOpenOnly'>;

type Geometry = {
  /** grid-template-columns shared by the header and every row, so MPPT groups line up. */
  template: string;
  /** Layout column → CSS grid column (1 is the inverter label; spacer columns sit between groups). */
  cssColumn: number[];
};

function geometryOf(layout: GridLayout, labelCh: number): Geometry {
  const parts = [`${labelCh}ch`];
  const cssColumn: number[] = [];
  let css = 2;
  layout.groups.forEach((group, g) => {
    if (g > 0) {
      parts.push('var(--sf-group-gap)');
      css += 1;
    }
    parts.push(`repeat(${group.width}, var(--sf-cell))`);
    for (let k = 0; k < group.width; k++) cssColumn[group.startColumn + k] = css + k;
    css += group.width;
  });
  return { template: parts.join(' '), cssColumn };
}

function firstRowsOf(rows: GridRow[], cellBudget: number): GridRow[] {
  let cells = 0;
  let n = 0;
  while (n < rows.length && cells < cellBudget) cells += rows[n++]!.cells.length;
  return rows.slice(0, n);
}

function findActive(rows: readonly GridRow[], activeId: number | null): { row: number; indexInRow: number } {
  if (activeId === null) return { row: 0, indexInRow: 0 };
  for (const [r, row] of rows.entries()) {
    const found = row.cells.find((p) => p.cell.stringId === activeId);
    if (found) return { row: r, indexInRow: found.indexInRow };
  }
  return { row: 0, indexInRow: 0 };
}

function rowSummary(row: GridRow): string {
  const c = row.counts;
  const parts = [`${row.cells.length} strings`];
  if (c.fail) parts.push(`${c.fail} fail`);
  if (c.attention) parts.push(`${c.attention} need attention`);
  if (c.unchecked) parts.push(`${c.unchecked} not checked`);
  if (c.pass) parts.push(`${c.pass} pass`);
  if (row.withOpenTickets) parts.push(`${row.withOpenTickets} with an open ticket`);
  return parts.join(', ');
}

type RowProps = {
  row: GridRow;
  rowIndex: number;
  /** Position of the roving-tabindex cell in this row, or -1: only the rows it leaves and enters re-render. */
  activeIndex: number;
  geometry: Geometry;
  verdict: CellFilter['verdict'];
  isOpenOnly: boolean;
  hrefFor: (stringId: number) => string;
};

/* Hover, tooltip and focus ring are handled without React state, so a row renders again only when
   the filters change or the keyboard focus enters or leaves it. */
const MapRow = memo(function MapRow({ row, rowIndex, activeIndex, geometry, verdict, isOpenOnly, hrefFor }: RowProps) {
  const filter = { verdict, isOpenOnly };
  const isFiltering = hasCellFilter(filter);
  return (
    <div role="row" className="sf-map-row grid gap-y-1" style={{ gridTemplateColumns: geometry.template, columnGap: 'var(--sf-gap)' }}>
      <div role="rowheader" className="sticky left-0 z-[3] -my-0.5 flex items-center bg-surface pr-2 pl-3 font-mono text-sm font-semibold text-ink" title={rowSummary(row)}>
        {row.inverterTag}
        <span className="sr-only">: {rowSummary(row)}</span>
      </div>
      {row.cells.map((placed) => {
        const { cell } = placed;
        const style = verdictStyles[cellVerdict(cell)];
        const isDim = isFiltering && !matchesCell(cell, filter);
        return (
          <a
            key={cell.stringId}
            role="gridcell"
            href={hrefFor(cell.stringId)}
            tabIndex={placed.indexInRow === activeIndex ? 0 : -1}
            data-r={rowIndex}
            data-i={placed.indexInRow}
            data-sid={cell.stringId}
            aria-label={cellAccessibleName(cell)}
            className={cn('sf-cell', style.className, cell.openTickets > 0 && 'sf-cell--ticket', isDim && 'sf-cell--dim')}
            style={{ gridColumnStart: geometry.cssColumn[placed.column] }}
          >
            {style.glyph ? <span aria-hidden="true">{style.glyph}</span> : null}
          </a>
        );
      })}
    </div>
  );
});

/**
 * The site's strings as the plant is wired: a row per inverter, MPPT inputs as aligned column
 * groups, combiner order along each input. One small link per string; arrow keys move between them
 * (one tab stop for the whole map), Enter or a click opens the string page. Scrolls within its own
 * box, with the inverter tags and MPPT headings pinned.
 */
export function HealthMap({
  layout,
  filters,
  hrefFor,
  onOpen,
  siteName,
}: {
  layout: GridLayout;
  filters: CellFilter & { inverter: string | undefined };
  hrefFor: (stringId: number) => string;
  onOpen: (stringId: number) => void;
  siteName: string;
}) {
  const helpId = useId();
  const gridRef = useRef<HTMLDivElement>(null);
  const tipRef = useRef<HTMLDivElement>(null);
  const [activeId, setActiveId] = useState<number | null>(null);
  const { verdict, isOpenOnly, inverter } = filters;

  // With a verdict or ticket filter, inverters without a single match step out of the way.
  const rows = useMemo(() => {
    const byInverter = inverter ? layout.rows.filter((r) => r.inverterTag === inverter) : layout.rows;
    const filter = { verdict, isOpenOnly };
    if (!hasCellFilter(filter)) return byInverter;
    return byInverter.filter((r) => r.cells.some((p) => matchesCell(p.cell, filter)));
  }, [layout, verdict, isOpenOnly, inverter]);

  const labelCh = useMemo(() => Math.max(5, ...layout.rows.map((r) => r.inverterTag.length)) + 5, [layout]);
  const geometry = useMemo(() => geometryOf(layout, labelCh), [layout, labelCh]);
  const cellsById = useMemo(() => {
    const map = new Map<number, HealthCell>();
    for (const row of layout.rows) for (const p of row.cells) map.set(p.cell.stringId, p.cell);
    return map;
  }, [layout]);

  // Where the single tab stop sits; falls back to the first string when the active one is filtered away.
  const active = useMemo(() => findActive(rows, activeId), [rows, activeId]);
  // A big plant paints its first inverters at once and the rest a moment later, in the background.
  const firstRows = useMemo(() => firstRowsOf(rows, 1200), [rows]);
  const shownRows = useDeferredValue(rows, firstRows);

  const showTip = useCallback(
    (target: Element) => {
      const tip = tipRef.current;
      const id = Number((target as HTMLElement).dataset.sid);
      const cell = cellsById.get(id);
      if (!tip || !cell) return;
      // Read the cell's box before writing anything, so the browser never lays out twice.
      const box = target.getBoundingClientRect();
      const facts = cellFacts(cell);
      const [label, verdict, deviations, checked, tickets] = Array.from(tip.children) as HTMLElement[];
      if (label) label.textContent = cell.label;
      if (verdict) verdict.textContent = facts.verdict;
      if (deviations) deviations.textContent = facts.deviations;
      if (checked) checked.textContent = facts.checked;
      if (tickets) tickets.textContent = facts.tickets;
      // Centred above the cell (below it near the top edge), kept inside the window without measuring the tip.
      const halfTip = Math.min(144, window.innerWidth / 2 - 8);
      const x = Math.min(Math.max(8 + halfTip, box.left + box.width / 2), window.innerWidth - 8 - halfTip);
      const isBelow = box.top < 140;
      tip.style.transform = `translate(${Math.round(x)}px, ${Math.round(isBelow ? box.bottom + 8 : box.top - 8)}px) translate(-50%, ${isBelow ? '0' : '-100%'})`;
      tip.hidden = false;
    },
    [cellsById],
  );
  const hideTip = () => {
    if (tipRef.current) tipRef.current.hidden = true;
  };

  const cellOf = (target: EventTarget | null): HTMLElement | null => (target instanceof Element ? target.closest<HTMLElement>('[data-sid]') : null);

  const onPointerOver = (e: PointerEvent) => {
    if (e.pointerType !== 'mouse') return;
    const cell = cellOf(e.target);
    if (cell) showTip(cell);
    else hideTip();
  };

  const onFocus = (e: FocusEvent) => {
    const cell = cellOf(e.target);
    if (!cell) return;
    showTip(cell);
    const id = Number(cell.dataset.sid);
    if (id !== activeId) setActiveId(id);
  };

  const onKeyDown = (e: KeyboardEvent) => {
    const cell = cellOf(e.target);
    if (!cell) return;
    if (e.key === 'Escape') return hideTip();
    const move = moveForKey(e.key, e.ctrlKey || e.metaKey);
    if (!move) return;
    e.preventDefault();
    const next = moveInGrid(rows, { row: Number(cell.dataset.r), indexInRow: Number(cell.dataset.i) }, move);
    const target = gridRef.current?.querySelector<HTMLElement>(`[data-r="${next.row}"][data-i="${next.indexInRow}"]`);
    // Focus first (the cell is focusable at tabindex -1), then move the tab stop; onFocus does the rest.
    target?.focus();
  };

  const onClick = (e: MouseEvent) => {
    const cell = cellOf(e.target);
    if (!cell || e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
    e.preventDefault();
    onOpen(Number(cell.dataset.sid));
  };

  return (
    <div className="sf-map">
      <p id={helpId} className="sr-only">
        One row per inverter, one column group per MPPT input. Arrow keys move between strings, Home and End go to the ends of a row, Enter opens the string.
      </p>
      <div className="max-h-[min(70vh,44rem)] overflow-auto overscroll-contain rounded-card border border-line bg-surface shadow-card" onScroll={hideTip}>
        {/* Event handlers sit on the grid once (delegation), not on thousands of cells. */}
        {/* eslint-disable-next-line jsx-a11y/interactive-supports-focus -- focus lives on the cells (roving tabindex), not the grid */}
        <div
          ref={gridRef}
          role="grid"
          aria-label={`String health map of ${siteName}`}
          aria-describedby={helpId}
          aria-readonly="true"
          className="flex w-max flex-col gap-1 pr-3 pb-3"
          onPointerOver={onPointerOver}
          onPointerLeave={hideTip}
          onFocus={onFocus}
          onBlur={hideTip}
          onKeyDown={onKeyDown}
          onClick={onClick}
        >
          <div role="row" className="sticky top-0 z-[4] grid bg-surface pt-3 pb-1" style={{ gridTemplateColumns: geometry.template, columnGap: 'var(--sf-gap)' }}>
            <div role="columnheader" className="sticky left-0 z-[3] bg-surface pl-3 text-xs font-semibold text-ink-muted">
              Inverter
            </div>
            {layout.groups.map((group) => (
              <div
                key={group.mpptInput}
                role="columnheader"
                aria-colspan={group.width}
                className="truncate border-b-2 border-edge/50 text-xs font-semibold text-ink-muted"
                style={{ gridColumn: `${geometry.cssColumn[group.startColumn]} / span ${group.width}` }}
                title={`MPPT input ${group.mpptInput}`}
              >
                <span aria-hidden="true">{group.width >= 3 ? `MPPT ${group.mpptInput}` : `M${group.mpptInput}`}</span>
                <span className="sr-only">MPPT input {group.mpptInput}</span>
              </div>
            ))}
          </div>
          {shownRows.map((row, r) => (
            <MapRow
              key={row.inverterTag}
              row={row}
              rowIndex={r}
              activeIndex={active.row === r ? active.indexInRow : -1}
              geometry={geometry}
              verdict={verdict}
              isOpenOnly={isOpenOnly}
              hrefFor={hrefFor}
            />
          ))}
        </div>
      </div>
      <div
        ref={tipRef}
        hidden
        aria-hidden="true"
        className="pointer-events-none fixed top-0 left-0 z-50 w-max max-w-72 rounded-control bg-ink px-3 py-2 text-sm text-white shadow-raised"
      >
        <p className="font-mono font-semibold" />
        <p className="font-semibold" />
        <p className="readings" />
        <p />
        <p />
      </div>
    </div>
  );
}
