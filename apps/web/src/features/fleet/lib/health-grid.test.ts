import { describe, expect, it } from 'vitest';
import { bySeverity, layoutHealthGrid, moveForKey, moveInGrid } from './health-grid';
import { buildHealthCell, buildPlant } from './test-factories';

describe('layoutHealthGrid', () => {
  it('puts one inverter per row in natural tag order, so INV2 comes before INV10', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, inverterTag: 'INV10' }),
      buildHealthCell({ stringId: 2, inverterTag: 'INV2' }),
      buildHealthCell({ stringId: 3, inverterTag: 'INV1' }),
    ]);
    expect(layout.rows.map((r) => r.inverterTag)).toEqual(['INV1', 'INV2', 'INV10']);
  });

  it('orders the strings of an MPPT input by combiner position, not by label', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, label: 'S1', combinerPosition: 3 }),
      buildHealthCell({ stringId: 2, label: 'S2', combinerPosition: 1 }),
      buildHealthCell({ stringId: 3, label: 'S3', combinerPosition: 2 }),
    ]);
    expect(layout.rows[0]!.cells.map((c) => c.cell.label)).toEqual(['S2', 'S3', 'S1']);
  });

  it('puts strings without a combiner position after the placed ones, by label', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, label: 'S10', combinerTag: null, combinerPosition: null }),
      buildHealthCell({ stringId: 2, label: 'S9', combinerTag: null, combinerPosition: null }),
      buildHealthCell({ stringId: 3, label: 'S1', combinerPosition: 4 }),
    ]);
    expect(layout.rows[0]!.cells.map((c) => c.cell.label)).toEqual(['S1', 'S9', 'S10']);
  });

  it('lines MPPT inputs up across inverters, each group as wide as its longest input', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, inverterTag: 'INV01', mpptInput: 1, combinerPosition: 1 }),
      buildHealthCell({ stringId: 2, inverterTag: 'INV01', mpptInput: 1, combinerPosition: 2 }),
      buildHealthCell({ stringId: 3, inverterTag: 'INV01', mpptInput: 2, combinerPosition: 3 }),
      buildHealthCell({ stringId: 4, inverterTag: 'INV02', mpptInput: 2, combinerPosition: 1 }),
    ]);
    expect(layout.groups).toEqual([
      { mpptInput: 1, startColumn: 0, width: 2 },
      { mpptInput: 2, startColumn: 2, width: 1 },
    ]);
    expect(layout.columnCount).toBe(3);
    // INV02 has nothing on input 1: its only string still sits under input 2.
    expect(layout.rows[1]!.cells.map((c) => [c.column, c.indexInRow])).toEqual([[2, 0]]);
  });

  it('counts verdicts and open tickets per inverter', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, verdict: 'fail', openTickets: 1 }),
      buildHealthCell({ stringId: 2, verdict: 'pass', combinerPosition: 2 }),
      buildHealthCell({ stringId: 3, verdict: null, combinerPosition: 3 }),
    ]);
    expect(layout.rows[0]!.counts).toEqual({ fail: 1, attention: 0, pass: 1, unchecked: 1 });
    expect(layout.rows[0]!.withOpenTickets).toBe(1);
  });

  it('lays out 5,000 shuffled strings of 50 inverters × 10 inputs × 10 strings in wiring order, in well under a frame budget', () => {
    const cells = buildPlant({ inverters: 50, inputs: 10, perInput: 10 });
    expect(cells).toHaveLength(5000);
    const started = performance.now();
    const layout = layoutHealthGrid(cells);
    const elapsedMs = performance.now() - started;

    expect(layout.cellCount).toBe(5000);
    expect(layout.rows).toHaveLength(50);
    expect(layout.columnCount).toBe(100);
    expect(layout.rows.map((r) => r.inverterTag)).toEqual(Array.from({ length: 50 }, (_, k) => `INV${String(k + 1).padStart(2, '0')}`));
    for (const row of layout.rows) {
      expect(row.cells).toHaveLength(100);
      expect(row.cells.map((c) => c.column)).toEqual(Array.from({ length: 100 }, (_, k) => k));
      expect(row.cells.map((c) => c.cell.label)).toEqual(
        Array.from({ length: 100 }, (_, k) => `${row.inverterTag}-MPPT${Math.floor(k / 10) + 1}-S${(k % 10) + 1}`),
      );
    }
    // Generous: a CI box is slower than a laptop, but layout must never be the jank.
    expect(elapsedMs).toBeLessThan(200);
  });
});

describe('moveInGrid', () => {
  const layout = layoutHealthGrid([
    buildHealthCell({ stringId: 1, inverterTag: 'INV01', mpptInput: 1, combinerPosition: 1 }),
    buildHealthCell({ stringId: 2, inverterTag: 'INV01', mpptInput: 1, combinerPosition: 2 }),
    buildHealthCell({ stringId: 3, inverterTag: 'INV01', mpptInput: 2, combinerPosition: 3 }),
    buildHealthCell({ stringId: 4, inverterTag: 'INV02', mpptInput: 1, combinerPosition: 1 }),
    buildHealthCell({ stringId: 5, inverterTag: 'INV03', mpptInput: 2, combinerPosition: 1 }),
  ]);
  const idAt = (p: { row: number; indexInRow: number }) => layout.rows[p.row]!.cells[p.indexInRow]!.cell.stringId;

  it('moves right along a row and stops at its end', () => {
    expect(idAt(moveInGrid(layout.rows, { row: 0, indexInRow: 1 }, 'right'))).toBe(3);
    expect(idAt(moveInGrid(layout.rows, { row: 0, indexInRow: 2 }, 'right'))).toBe(3);
  });

  it('moves down to the nearest column of a shorter row', () => {
    expect(idAt(moveInGrid(layout.rows, { row: 0, indexInRow: 2 }, 'down'))).toBe(4);
    expect(idAt(moveInGrid(layout.rows, { row: 1, indexInRow: 0 }, 'down'))).toBe(5);
  });

  it('stays on the first row when moving up from it', () => {
    expect(moveInGrid(layout.rows, { row: 0, indexInRow: 1 }, 'up')).toEqual({ row: 0, indexInRow: 1 });
  });

  it('jumps to the first and last string with Ctrl+Home and Ctrl+End', () => {
    expect(moveForKey('Home', true)).toBe('first');
    expect(moveForKey('End', false)).toBe('rowEnd');
    expect(idAt(moveInGrid(layout.rows, { row: 1, indexInRow: 0 }, 'last'))).toBe(5);
  });

  it('ignores keys that are not grid moves', () => {
    expect(moveForKey('Enter', false)).toBeNull();
  });
});

describe('bySeverity', () => {
  it('lists fails, then attention, then unchecked, then passes, open tickets first within a verdict', () => {
    const layout = layoutHealthGrid([
      buildHealthCell({ stringId: 1, verdict: 'pass', combinerPosition: 1 }),
      buildHealthCell({ stringId: 2, verdict: null, combinerPosition: 2 }),
      buildHealthCell({ stringId: 3, verdict: 'attention', combinerPosition: 3 }),
      buildHealthCell({ stringId: 4, verdict: 'fail', combinerPosition: 4 }),
      buildHealthCell({ stringId: 5, verdict: 'attention', combinerPosition: 5, openTickets: 1 }),
    ]);
    expect([...layout.rows[0]!.cells].sort(bySeverity).map((c) => c.cell.stringId)).toEqual([4, 5, 3, 2, 1]);
  });
});
