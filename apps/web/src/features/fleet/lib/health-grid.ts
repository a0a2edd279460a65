import type { HealthCell } from '@stringfield/shared';
import { cellVerdict, verdictStyles, type CellVerdict } from './verdict-style';

/** One string placed on the map: its inverter row and its column across the site's MPPT groups. */
export type PlacedCell = {
  cell: HealthCell;
  /** Row number among the inverters (0-based). */
  row: number;
  /** Column across all MPPT groups (0-based, spacer columns not counted). */
  column: number;
  /** Position within the row's cells, left to right. */
  indexInRow: number;
};

export type GridRow = {
  inverterTag: string;
  cells: PlacedCell[];
  counts: Record<CellVerdict, number>;
  withOpenTickets: number;
};

export type MpptGroup = { mpptInput: number; startColumn: number; width: number };

export type GridLayout = {
  groups: MpptGroup[];
  columnCount: number;
  rows: GridRow[];
  cellCount: number;
};

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/** Tags and labels in the order a person counts them: INV2 before INV10. */
export const naturalCompare = (a: string, b: string) => collator.compare(a, b);

/**
 * Along an MPPT input, strings sit in combiner order: by combiner box, then position in it; where
 * the layout has no combiner or position, by label, after the ones that have one.
 */
export function compareWithinInput(a: HealthCell, b: HealthCell): number {
  const hasA = a.combinerPosition !== null;
  const hasB = b.combinerPosition !== null;
  if (hasA !== hasB) return hasA ? -1 : 1;
  if (hasA && hasB) {
    const byBox = naturalCompare(a.combinerTag ?? '', b.combinerTag ?? '');
    if (byBox !== 0) return byBox;
    if (a.combinerPosition !== b.combinerPosition) return (a.combinerPosition ?? 0) - (b.combinerPosition ?? 0);
  }
  return naturalCompare(a.label, b.label) || a.stringId - b.stringId;
}

const emptyCounts = (): Record<CellVerdict, number> => ({ fail: 0, attention: 0, pass: 0, unchecked: 0 });

/**
 * Lays a site's strings out as the plant is wired: one row per inverter, MPPT inputs as column
 * groups that line up across rows (each group as wide as its longest input anywhere on the site),
 * strings in combiner order within an input. Linear in the number of strings plus one sort.
 */
export function layoutHealthGrid(cells: readonly HealthCell[]): GridLayout {
  const byInverter = new Map<string, Map<number, HealthCell[]>>();
  for (const cell of cells) {
    let inputs = byInverter.get(cell.inverterTag);
    if (!inputs) byInverter.set(cell.inverterTag, (inputs = new Map<number, HealthCell[]>()));
    const list = inputs.get(cell.mpptInput);
    if (list) list.push(cell);
    else inputs.set(cell.mpptInput, [cell]);
  }

  const widths = new Map<number, number>();
  for (const inputs of byInverter.values()) {
    for (const [mppt, list] of inputs) {
      list.sort(compareWithinInput);
      widths.set(mppt, Math.max(widths.get(mppt) ?? 0, list.length));
    }
  }

  const groups: MpptGroup[] = [];
  let columnCount = 0;
  for (const mpptInput of [...widths.keys()].sort((a, b) => a - b)) {
    const width = widths.get(mpptInput) ?? 0;
    groups.push({ mpptInput, startColumn: columnCount, width });
    columnCount += width;
  }
  const startOf = new Map(groups.map((g) => [g.mpptInput, g.startColumn]));

  const tags = [...byInverter.keys()].sort(naturalCompare);
  const rows: GridRow[] = tags.map((inverterTag, row) => {
    const inputs = byInverter.get(inverterTag)!;
    const placed: PlacedCell[] = [];
    const counts = emptyCounts();
    let withOpenTickets = 0;
    for (const group of groups) {
      const list = inputs.get(group.mpptInput);
      if (!list) continue;
      list.forEach((cell, k) => {
        placed.push({ cell, row, column: (startOf.get(group.mpptInput) ?? 0) + k, indexInRow: placed.length });
        counts[cellVerdict(cell)] += 1;
        if (cell.openTickets > 0) withOpenTickets += 1;
      });
    }
    return { inverterTag, cells: placed, counts, withOpenTickets };
  });

  return { groups, columnCount, rows, cellCount: cells.length };
}

/** The cell in `row` nearest to `column`, for moving up and down between inverters of unequal width. */
export function nearestInRow(row: GridRow, column: number): PlacedCell | undefined {
  let best: PlacedCell | undefined;
  for (const placed of row.cells) {
    if (!best || Math.abs(placed.column - column) < Math.abs(best.column - column)) best = placed;
    if (placed.column >= column) break;
  }
  return best;
}

export type GridMove = 'left' | 'right' | 'up' | 'down' | 'rowStart' | 'rowEnd' | 'first' | 'last' | 'pageUp' | 'pageDown';

/** Where a key press lands, from row and position-in-row; stays put at the edges. */
export function moveInGrid(rows: readonly GridRow[], from: { row: number; indexInRow: number }, move: GridMove, pageRows = 5): { row: number; indexInRow: number } {
  const current = rows[from.row]?.cells[from.indexInRow];
  if (!current) return from;
  const at = (row: number, indexInRow: number) => ({ row, indexInRow });
  const vertical = (target: number) => {
    const clamped = Math.max(0, Math.min(rows.length - 1, target));
    const landing = rows[clamped] ? nearestInRow(rows[clamped], current.column) : undefined;
    return landing ? at(clamped, landing.indexInRow) : from;
  };
  const rowCells = rows[from.row]?.cells ?? [];
  switch (move) {
    case 'left':
      return at(from.row, Math.max(0, from.indexInRow - 1));
    case 'right':
      return at(from.row, Math.min(rowCells.length - 1, from.indexInRow + 1));
    case 'rowStart':
      return at(from.row, 0);
    case 'rowEnd':
      return at(from.row, rowCells.length - 1);
    case 'up':
      return vertical(from.row - 1);
    case 'down':
      return vertical(from.row + 1);
    case 'pageUp':
      return vertical(from.row - pageRows);
    case 'pageDown':
      return vertical(from.row + pageRows);
    case 'first':
      return at(0, 0);
    case 'last': {
      const lastRow = rows.length - 1;
      return at(lastRow, Math.max(0, (rows[lastRow]?.cells.length ?? 1) - 1));
    }
  }
}

/** Key → move, following the ARIA grid pattern. */
export function moveForKey(key: string, isCtrl: boolean): GridMove | null {
  switch (key) {
    case 'ArrowLeft':
      return 'left';
    case 'ArrowRight':
      return 'right';
    case 'ArrowUp':
      return 'up';
    case 'ArrowDown':
      return 'down';
    case 'Home':
      return isCtrl ? 'first' : 'rowStart';
    case 'End':
      return isCtrl ? 'last' : 'rowEnd';
    case 'PageUp':
      return 'pageUp';
    case 'PageDown':
      return 'pageDown';
    default:
      return null;
  }
}

/** Worst first (fail, attention, unchecked, pass), then as laid out: the order of the list view. */
export function bySeverity(a: PlacedCell, b: PlacedCell): number {
  const s = verdictStyles[cellVerdict(a.cell)].severity - verdictStyles[cellVerdict(b.cell)].severity;
  if (s !== 0) return s;
  if (a.cell.openTickets > 0 !== b.cell.openTickets > 0) return a.cell.openTickets > 0 ? -1 : 1;
  return a.row - b.row || a.indexInRow - b.indexInRow;
}
