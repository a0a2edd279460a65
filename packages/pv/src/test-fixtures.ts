import type { ModuleSpec } from './types.ts';

/**
 * Test fixtures (not exported from the package). The 60-cell datasheet is the published parameter
 * set of pvlib `test_fit_desoto` (pv-field-testing §5.4 / §11 item 6): Vmp 31.0 V, Imp 8.71 A,
 * Voc 38.3 V, Isc 9.43 A, α 0.005658 A/K (= 0.06 %/K), β −0.13788 V/K (= −0.36 %/K), 60 cells.
 * Pmax is Vmp × Imp; γ and the 3 bypass diodes are invented (γ is not used by the model).
 */
export function buildModule(overrides: Partial<ModuleSpec> = {}): ModuleSpec {
  return {
    pmaxW: 31.0 * 8.71,
    vocV: 38.3,
    iscA: 9.43,
    vmpV: 31.0,
    impA: 8.71,
    alphaIscPctPerC: 0.06,
    betaVocPctPerC: -0.36,
    gammaPmaxPctPerC: -0.4,
    cellsInSeries: 60,
    bypassDiodes: 3,
    ...overrides,
  };
}

/** An invented 72-cell module (no brand; plausible datasheet values). */
export function buildInvented72CellModule(): ModuleSpec {
  return {
    pmaxW: 320,
    vocV: 46.2,
    iscA: 9.1,
    vmpV: 37.4,
    impA: 8.56,
    alphaIscPctPerC: 0.05,
    betaVocPctPerC: -0.3,
    gammaPmaxPctPerC: -0.39,
    cellsInSeries: 72,
    bypassDiodes: 3,
  };
}

/** The pvlib `test_singlediode_floats` parameters (§11 items 2–3). */
export const PVLIB_SDM = {
  photoCurrentA: 7,
  saturationCurrentA: 6e-7,
  seriesOhm: 0.1,
  shuntOhm: 20,
  modifiedIdealityV: 0.5,
} as const;
