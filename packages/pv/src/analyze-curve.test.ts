import { describe, expect, it } from 'vitest';
import { analyzeCurve } from './analyze-curve.ts';
import { fitSingleDiode } from './fit-single-diode.ts';
import { simulateString, type ShadedCell } from './simulate-string.ts';
import { singleDiodeCurrent } from './single-diode-current.ts';
import { singleDiodeVoltage } from './single-diode-voltage.ts';
import { buildModule, PVLIB_SDM } from './test-fixtures.ts';
import type { SingleDiodeParams } from './types.ts';

/** 300 points of a single-diode curve, uniform in voltage, as a curve tracer gives them. */
const traceOf = (params: SingleDiodeParams) => {
  const vocV = singleDiodeVoltage(params, 0);
  return Array.from({ length: 300 }, (_, k) => {
    const voltageV = (vocV * k) / 299;
    return { voltageV, currentA: k === 299 ? 0 : singleDiodeCurrent(params, voltageV) };
  });
};
const module = buildModule();
const substring = (mod: number, index: number, fraction: number): ShadedCell[] =>
  Array.from({ length: 20 }, (_, c) => ({ module: mod, cell: index * 20 + c, fraction }));

describe('analyzeCurve', () => {
  const pvlib = analyzeCurve(traceOf(PVLIB_SDM), { modifiedIdealityV: 0.5 });

  it.each([
    // pvlib test_singlediode_floats (pv-field-testing §11 item 2); tolerance for a 300-point trace [derived]
    { key: 'iscA', value: 6.965172322, rtol: 1e-6 },
    { key: 'vocV', value: 8.106300147, rtol: 1e-4 },
    { key: 'pmpW', value: 38.19421055, rtol: 1e-3 },
    { key: 'vmpV', value: 6.224339375, rtol: 5e-3 },
    // slope estimates, pvlib case (pv-field-testing §11 item 22 [derived])
    { key: 'rocOhm', value: 0.17553, rtol: 0.01 },
    { key: 'seriesOhmEstimate', value: 0.10375, rtol: 0.01 },
    { key: 'rscOhm', value: 20.098, rtol: 0.01 },
  ] as const)('reads $key ≈ $value from a sampled pvlib curve', ({ key, value, rtol }) => {
    expect(Math.abs(pvlib[key] / value - 1)).toBeLessThan(rtol);
  });

  it('reads the 60-cell fit’s slopes: R_oc 0.47152 Ω, corrected 0.30278 Ω, R_sc 126.096 Ω (§11 item 22 [derived])', () => {
    const fit = fitSingleDiode(module);
    const r = analyzeCurve(traceOf(fit), { modifiedIdealityV: fit.modifiedIdealityV });
    expect(Math.abs(r.rocOhm / 0.47152 - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.seriesOhmEstimate / 0.30278 - 1)).toBeLessThan(0.015);
    expect(Math.abs(r.rscOhm / 126.096 - 1)).toBeLessThan(0.01);
  });

  it('gives the 60-cell fit a fill factor of 0.748 (pv-field-testing §1.3 [derived])', () => {
    expect(analyzeCurve(traceOf(fitSingleDiode(module))).fillFactor).toBeCloseTo(0.748, 3);
  });

  it('finds no step on a healthy string', () => {
    const sim = simulateString({ module, modulesInSeries: 6, irradianceWm2: 1000, moduleTempC: 25 });
    expect(analyzeCurve(sim.curve, { substringVocV: 38.3 / 3 }).steps).toEqual([]);
  });

  it('finds one step when one substring is half shaded, dropping towards half of Isc (§9.3)', () => {
    const sim = simulateString({
      module,
      modulesInSeries: 6,
      irradianceWm2: 1000,
      moduleTempC: 25,
      shading: substring(0, 0, 0.5),
    });
    const { steps } = analyzeCurve(sim.curve, { substringVocV: 38.3 / 3 });
    expect(steps).toHaveLength(1);
    // the plateau sits near the shaded photocurrent, 0.5 × 9.45 A (De Soto IL, pvlib test_fit_desoto); the corner near Isc
    expect(steps[0]?.atA).toBeGreaterThan(0.9 * 9.43);
    expect((steps[0]?.atA ?? 0) - (steps[0]?.dropA ?? 0)).toBeCloseTo(0.5 * 9.45, 0);
  });

  it('finds two steps when two substrings are shaded by different amounts (§9.3)', () => {
    const sim = simulateString({
      module,
      modulesInSeries: 6,
      irradianceWm2: 1000,
      moduleTempC: 25,
      shading: [...substring(0, 0, 0.3), ...substring(5, 1, 0.7)],
    });
    expect(analyzeCurve(sim.curve, { substringVocV: 38.3 / 3 }).steps).toHaveLength(2);
  });

  it('sorts points given in any order', () => {
    const trace = traceOf(PVLIB_SDM);
    expect(analyzeCurve([...trace].reverse()).pmpW).toBeCloseTo(analyzeCurve(trace).pmpW, 9);
  });

  it('throws on a curve of 3 points (programmer error)', () => {
    expect(() => analyzeCurve(traceOf(PVLIB_SDM).slice(0, 3))).toThrow(RangeError);
  });
});
