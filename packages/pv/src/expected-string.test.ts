import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expectedString } from './expected-string.ts';
import { singleDiodeParamsAt } from './single-diode-params-at.ts';
import { solveSingleDiode } from './solve-single-diode.ts';
import { buildModule } from './test-fixtures.ts';

const module = buildModule();
const one = (irradianceWm2: number, moduleTempC: number) =>
  expectedString({ module, modulesInSeries: 1, irradianceWm2, moduleTempC });

describe('expectedString', () => {
  it.each([
    // simple §1.1 formulas (pv-field-testing §11 item 8 [derived])
    { g: 800, t: 45, key: 'iscA', value: 7.6345 },
    { g: 800, t: 45, key: 'vocV', value: 35.1635 },
    // §11 item 9 [derived]
    { g: 500, t: 25, key: 'vocV', value: 37.197 },
    { g: 500, t: 25, key: 'iscA', value: 4.715 },
    // STC is the datasheet (definition)
    { g: 1000, t: 25, key: 'vocV', value: 38.3 },
    { g: 1000, t: 25, key: 'iscA', value: 9.43 },
  ] as const)(
    'gives module $key ≈ $value at $g W/m² and $t °C (pv-field-testing §11 items 8–9)',
    ({ g, t, key, value }) => {
      expect(one(g, t)[key]).toBeCloseTo(value, 3);
    },
  );

  it('gives Vmp, Imp and Pmp of the De Soto model: 198.409 W at 800 W/m², 45 °C (§11 item 8 [derived])', () => {
    expect(one(800, 45).pmpW / 198.409 - 1).toBeLessThan(1e-5);
  });

  it('multiplies voltages and power by the modules in series and keeps one module’s current (physics, §1.1)', () => {
    const string = expectedString({ module, modulesInSeries: 20, irradianceWm2: 800, moduleTempC: 45 });
    const single = one(800, 45);
    expect(string.vocV).toBeCloseTo(20 * single.vocV, 9);
    expect(string.vmpV).toBeCloseTo(20 * single.vmpV, 9);
    expect(string.pmpW).toBeCloseTo(20 * single.pmpW, 9);
    expect(string.iscA).toBe(single.iscA);
  });

  it('matches a 60-cell module’s trade figures: ≈ 40 V Voc and ≈ 32 V Vmp (common practice, no source; ±10 %)', () => {
    const stc = one(1000, 25);
    expect(Math.abs(stc.vocV / 40 - 1)).toBeLessThan(0.1);
    expect(Math.abs(stc.vmpV / 32 - 1)).toBeLessThan(0.1);
  });

  it.each(
    // IEC 61853-1 grid points inside 200–1000 W/m² and 25–50 °C (pv-field-testing §10); agreement claimed in §1.1 [derived]
    [200, 400, 600, 800, 1000].flatMap((g) => [25, 50].map((t) => ({ g, t }))),
  )(
    'agrees with the full De Soto model within 0.2 % on Isc and 0.04 % on Voc at $g W/m², $t °C (§1.1 [derived])',
    ({ g, t }) => {
      const simple = one(g, t);
      const sdm = solveSingleDiode(singleDiodeParamsAt(module, { irradianceWm2: g, cellTempC: t }));
      expect(Math.abs(simple.iscA / sdm.iscA - 1)).toBeLessThan(0.002);
      expect(Math.abs(simple.vocV / sdm.vocV - 1)).toBeLessThan(0.0004);
    },
  );

  it('lowers Voc and raises Isc with temperature (property: β < 0, α > 0)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1200, noNaN: true }),
        fc.double({ min: -20, max: 70, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (g, t, dt) => {
          const cool = one(g, t);
          const warm = one(g, t + dt);
          expect(warm.vocV).toBeLessThan(cool.vocV);
          expect(warm.iscA).toBeGreaterThan(cool.iscA);
        },
      ),
    );
  });

  it('raises Voc logarithmically and Isc linearly with irradiance (property, §1.1)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1000, noNaN: true }),
        fc.double({ min: 1.05, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        (g, factor, t) => {
          const dim = one(g, t);
          const bright = one(g * factor, t);
          expect(bright.vocV).toBeGreaterThan(dim.vocV);
          expect(bright.iscA / dim.iscA).toBeCloseTo(factor, 9);
          expect(bright.pmpW).toBeGreaterThan(dim.pmpW);
        },
      ),
    );
  });

  it('keeps Vmp below Voc and Imp below Isc (consistency of the two models)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1200, noNaN: true }),
        fc.double({ min: -20, max: 75, noNaN: true }),
        (g, t) => {
          const e = one(g, t);
          expect(e.vmpV).toBeLessThan(e.vocV);
          expect(e.impA).toBeLessThan(e.iscA);
        },
      ),
    );
  });

  it('throws for a string of 0 modules (programmer error)', () => {
    expect(() =>
      expectedString({ module, modulesInSeries: 0, irradianceWm2: 1000, moduleTempC: 25 }),
    ).toThrow(RangeError);
  });
});
