import { describe, expect, it } from 'vitest';
import { fitSingleDiode } from './fit-single-diode.ts';
import { solveSingleDiode } from './solve-single-diode.ts';
import { buildInvented72CellModule, buildModule } from './test-fixtures.ts';

describe('fitSingleDiode (De Soto, Klein & Beckman 2006)', () => {
  const fit = fitSingleDiode(buildModule());
  it.each([
    // pvlib test_fit_desoto, rtol 1e-4 (pv-field-testing §11 item 6)
    { key: 'photoCurrentA', value: 9.45232 },
    { key: 'saturationCurrentA', value: 3.2246e-10 },
    { key: 'seriesOhm', value: 0.297814 },
    { key: 'shuntOhm', value: 125.798 },
    { key: 'modifiedIdealityV', value: 1.59128 },
  ] as const)(
    'fits $key = $value for the published 60-cell datasheet (pvlib test_fit_desoto)',
    ({ key, value }) => {
      expect(Math.abs(fit[key] / value - 1)).toBeLessThan(1e-4);
    },
  );

  it('names the published method it uses', () => {
    expect(fit.method).toBe('De Soto, Klein & Beckman 2006');
  });

  it('gives an ideality factor n between 1.0 and 1.3 for c-Si (pv-field-testing §1.1, from memory)', () => {
    expect(fit.idealityFactor).toBeGreaterThan(1.0);
    expect(fit.idealityFactor).toBeLessThan(1.3);
  });

  it.each([
    // the published set (pvlib test_fit_desoto) and an invented 72-cell module; the issue asks for 0.5 %
    { name: 'published 60-cell', module: buildModule() },
    { name: 'invented 72-cell', module: buildInvented72CellModule() },
  ])(
    'reproduces the $name datasheet Isc, Voc, Vmp and Imp within 0.5 % (issue 3 acceptance)',
    ({ module }) => {
      const points = solveSingleDiode(fitSingleDiode(module));
      expect(Math.abs(points.iscA / module.iscA - 1)).toBeLessThan(0.005);
      expect(Math.abs(points.vocV / module.vocV - 1)).toBeLessThan(0.005);
      expect(Math.abs(points.vmpV / module.vmpV - 1)).toBeLessThan(0.005);
      expect(Math.abs(points.impA / module.impA - 1)).toBeLessThan(0.005);
    },
  );

  it('lowers Voc by about β per kelvin when asked for 35 °C (equation 5 of the fit uses β, §5.4)', () => {
    const hot = solveSingleDiode(fitSingleDiode(buildModule(), { tempC: 35 }));
    // β = −0.13788 V/K (pvlib test_fit_desoto); the SDM follows it within 2 % over 10 K [derived]
    expect((hot.vocV - 38.3) / 10).toBeCloseTo(-0.13788, 2);
  });

  it('throws for a datasheet with Vmp above Voc (programmer error)', () => {
    expect(() => fitSingleDiode(buildModule({ vmpV: 40 }))).toThrow(RangeError);
  });
});
