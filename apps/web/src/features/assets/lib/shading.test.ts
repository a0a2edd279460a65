import { describe, expect, it } from 'vitest';
import { buildShading, type ShadeScenario } from './shading';

const m72 = { cellsInSeries: 72, bypassDiodes: 3 };
const none: ShadeScenario = { shadedModule: 1, shadedCells: 0, shadeFraction: 0.5, layout: 'along', bypassedSubstrings: 0 };

describe('buildShading', () => {
  it('shades nothing when no cell and no substring is chosen', () => {
    expect(buildShading(none, m72, 28)).toEqual([]);
  });

  it('puts three half-shaded cells along the series path of module 5 (0-based module 4)', () => {
    expect(buildShading({ ...none, shadedModule: 5, shadedCells: 3 }, m72, 28)).toEqual([
      { module: 4, cell: 0, fraction: 0.5 },
      { module: 4, cell: 1, fraction: 0.5 },
      { module: 4, cell: 2, fraction: 0.5 },
    ]);
  });

  it('spreads cells across the three substrings of a 72-cell module (cells 0, 24, 48)', () => {
    const cells = buildShading({ ...none, shadedCells: 3, layout: 'across' }, m72, 28).map((c) => c.cell);
    expect(cells).toEqual([0, 24, 48]);
  });

  it('darkens every cell of four substrings, spilling from module 1 into module 2', () => {
    const cells = buildShading({ ...none, bypassedSubstrings: 4 }, m72, 28);
    expect(cells).toHaveLength(4 * 24);
    expect(cells.every((c) => c.fraction === 1)).toBe(true);
    expect(new Set(cells.map((c) => c.module))).toEqual(new Set([0, 1]));
  });

  it('clamps a half-typed module number and cell count to the string', () => {
    const cells = buildShading({ ...none, shadedModule: 99, shadedCells: 500 }, m72, 28);
    expect(cells).toHaveLength(72);
    expect(cells[0]?.module).toBe(27);
  });
});
