import type { ShadedCell } from '@stringfield/pv';

export type ShadeLayout = 'along' | 'across';

/** A what-if scenario as a person states it: 1-based module number, counts and a fraction. */
export type ShadeScenario = {
  /** Module along the string, 1 = the first module from the + end. */
  shadedModule: number;
  /** Shaded cells in that module (0 = no shade). */
  shadedCells: number;
  /** Share of the light blocked on each shaded cell, 0 … 1. */
  shadeFraction: number;
  /** `along`: cells follow the series path (one substring first); `across`: one cell per substring in turn (a pole's shadow across the module). */
  layout: ShadeLayout;
  /** Substrings forced out entirely, from the first module on (a dead substring or a shorted bypass diode). */
  bypassedSubstrings: number;
};

export type ModuleLayout = { cellsInSeries: number; bypassDiodes: number };

/**
 * Turns a scenario into the `shading` list of `simulateString` (0-based module and cell numbers).
 * Values outside the string are clamped, so a half-typed form never throws.
 */
export function buildShading(scenario: ShadeScenario, module: ModuleLayout, modulesInSeries: number): ShadedCell[] {
  const cellsPerSubstring = module.cellsInSeries / module.bypassDiodes;
  const cells: ShadedCell[] = [];

  const shadedModule = clampInt(scenario.shadedModule, 1, modulesInSeries) - 1;
  const shadedCells = clampInt(scenario.shadedCells, 0, module.cellsInSeries);
  const fraction = Math.min(1, Math.max(0, Number.isFinite(scenario.shadeFraction) ? scenario.shadeFraction : 0));
  if (fraction > 0) {
    for (let k = 0; k < shadedCells; k += 1) {
      const cell =
        scenario.layout === 'along'
          ? k
          : (k % module.bypassDiodes) * cellsPerSubstring + Math.floor(k / module.bypassDiodes);
      cells.push({ module: shadedModule, cell, fraction });
    }
  }

  const bypassed = clampInt(scenario.bypassedSubstrings, 0, modulesInSeries * module.bypassDiodes);
  for (let s = 0; s < bypassed; s += 1) {
    const m = Math.floor(s / module.bypassDiodes);
    const first = (s % module.bypassDiodes) * cellsPerSubstring;
    for (let c = 0; c < cellsPerSubstring; c += 1) cells.push({ module: m, cell: first + c, fraction: 1 });
  }
  return cells;
}

function clampInt(value: number, min: number, max: number): number {
  if (!Number.isFinite(value)) return min;
  return Math.min(max, Math.max(min, Math.round(value)));
}
