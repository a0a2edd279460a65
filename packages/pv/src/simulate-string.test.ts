import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expectedString } from './expected-string.ts';
import { simulateString, type ShadedCell } from './simulate-string.ts';
import { singleDiodeParamsAt } from './single-diode-params-at.ts';
import { singleDiodeVoltage } from './single-diode-voltage.ts';
import { buildInvented72CellModule, buildModule } from './test-fixtures.ts';

const module = buildModule();
const noBreakdown = { breakdownV: -15, a: 0, m: 3 };
/** All 20 cells of one substring, shaded by `fraction`. */
const substring = (mod: number, index: number, fraction: number): ShadedCell[] =>
  Array.from({ length: 20 }, (_, c) => ({ module: mod, cell: index * 20 + c, fraction }));
/** Voltage of a curve at a current, by linear interpolation (the curve's current falls with voltage). */
const voltageAt = (curve: readonly { voltageV: number; currentA: number }[], currentA: number): number => {
  for (let k = 1; k < curve.length; k += 1) {
    const p = curve[k - 1];
    const q = curve[k];
    if (p && q && p.currentA >= currentA && q.currentA <= currentA) {
      return (
        p.voltageV + ((p.currentA - currentA) / (p.currentA - q.currentA || 1)) * (q.voltageV - p.voltageV)
      );
    }
  }
  throw new Error(`current ${currentA} A not on the curve`);
};

describe('simulateString', () => {
  it('reproduces N × the module single-diode model when nothing is shaded (independent Lambert-W path, pv-field-testing §5.2)', () => {
    const sim = simulateString({
      module,
      modulesInSeries: 20,
      irradianceWm2: 800,
      moduleTempC: 45,
      reverse: noBreakdown,
    });
    const model = expectedString({ module, modulesInSeries: 20, irradianceWm2: 800, moduleTempC: 45 });
    const moduleVoc = singleDiodeVoltage(
      singleDiodeParamsAt(module, { irradianceWm2: 800, cellTempC: 45 }),
      0,
    );
    expect(sim.vocV / (20 * moduleVoc) - 1).toBeCloseTo(0, 9);
    expect(sim.pmpW / model.pmpW - 1).toBeCloseTo(0, 7);
    expect(sim.vmpV / model.vmpV - 1).toBeCloseTo(0, 4);
    // De Soto Isc 7.6379 A at 800 W/m², 45 °C (pv-field-testing §11 item 8 [derived])
    expect(sim.iscA).toBeCloseTo(7.6379, 4);
  });

  it('gives each cell ≈ 0.6–0.7 V open circuit and ≈ 0.5 V at maximum power (common practice, no source)', () => {
    const sim = simulateString({ module, modulesInSeries: 1, irradianceWm2: 1000, moduleTempC: 25 });
    expect(sim.vocV / 60).toBeGreaterThan(0.6);
    expect(sim.vocV / 60).toBeLessThan(0.7);
    expect(sim.vmpV / 60).toBeGreaterThan(0.45);
    expect(sim.vmpV / 60).toBeLessThan(0.55);
  });

  it('changes the healthy string by less than 0.01 % when Bishop breakdown is switched on (breakdown acts only in reverse bias)', () => {
    const off = simulateString({
      module,
      modulesInSeries: 10,
      irradianceWm2: 1000,
      moduleTempC: 25,
      reverse: noBreakdown,
    });
    const on = simulateString({ module, modulesInSeries: 10, irradianceWm2: 1000, moduleTempC: 25 });
    expect(Math.abs(on.pmpW / off.pmpW - 1)).toBeLessThan(1e-4);
  });

  it('loses one substring’s voltage plus one diode drop at high current when a substring is shaded (voltage addition at equal current, §6.2)', () => {
    const dropV = 0.5;
    const sim = simulateString({
      module,
      modulesInSeries: 6,
      irradianceWm2: 1000,
      moduleTempC: 25,
      shading: substring(0, 0, 0.5),
      bypassDiodeDropV: dropV,
      reverse: noBreakdown,
      points: 2000,
    });
    const params = singleDiodeParamsAt(module, { irradianceWm2: 1000, cellTempC: 25 });
    const currentA = 8;
    // healthy: 6 modules = 18 substrings; shaded: 17 healthy substrings and one clamped at −Vf
    const healthyV = 6 * singleDiodeVoltage(params, currentA);
    const expectedV = (healthyV * 17) / 18 - dropV;
    expect(voltageAt(sim.curve, currentA)).toBeCloseTo(expectedV, 1);
  });

  it('shows the bypassed substring at the maximum-power point and a lower Pmp', () => {
    const healthy = simulateString({ module, modulesInSeries: 6, irradianceWm2: 1000, moduleTempC: 25 });
    const shaded = simulateString({
      module,
      modulesInSeries: 6,
      irradianceWm2: 1000,
      moduleTempC: 25,
      shading: substring(0, 0, 0.5),
    });
    expect(shaded.bypassedSubstringsAtMpp).toBe(1);
    expect(healthy.bypassedSubstringsAtMpp).toBe(0);
    // about one substring of 18 lost at the MPP (physics, §6.2): within 1 % of 17/18 of the healthy power
    expect(shaded.pmpW / healthy.pmpW).toBeCloseTo(17 / 18, 2);
  });

  it('bypasses the three substrings holding three shaded cells in a 30 × 72-cell string (the benchmark case)', () => {
    const shading = [0, 10, 20].map((m) => ({ module: m, cell: 5, fraction: 0.7 }));
    const sim = simulateString({
      module: buildInvented72CellModule(),
      modulesInSeries: 30,
      irradianceWm2: 1000,
      moduleTempC: 45,
      shading,
    });
    expect(sim.bypassedSubstringsAtMpp).toBe(3);
    expect(sim.curve).toHaveLength(400);
    // identical cells share one curve: unshaded + one shaded type; identical substrings one sum
    expect(sim.distinctCells).toBe(2);
    expect(sim.distinctSubstrings).toBe(2);
  });

  it('keeps Voc nearly unchanged under shade, since a shaded cell still gives voltage (log dependence, §7)', () => {
    const healthy = simulateString({ module, modulesInSeries: 10, irradianceWm2: 1000, moduleTempC: 25 });
    const shaded = simulateString({
      module,
      modulesInSeries: 10,
      irradianceWm2: 1000,
      moduleTempC: 25,
      shading: substring(2, 1, 0.5),
    });
    expect(shaded.vocV).toBeLessThan(healthy.vocV);
    expect(shaded.vocV / healthy.vocV).toBeGreaterThan(0.995);
  });

  it('returns a monotone curve from (0 V, Isc) to (Voc, 0 A) (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            module: fc.integer({ min: 0, max: 3 }),
            cell: fc.integer({ min: 0, max: 59 }),
            fraction: fc.double({ min: 0, max: 1, noNaN: true }),
          }),
          { maxLength: 6 },
        ),
        (shading) => {
          const sim = simulateString({
            module,
            modulesInSeries: 4,
            irradianceWm2: 900,
            moduleTempC: 40,
            shading,
            points: 100,
          });
          expect(sim.curve[0]?.voltageV).toBe(0);
          expect(sim.curve[sim.curve.length - 1]?.currentA).toBe(0);
          for (let k = 1; k < sim.curve.length; k += 1) {
            expect(sim.curve[k]?.voltageV ?? 0).toBeGreaterThanOrEqual(
              (sim.curve[k - 1]?.voltageV ?? 0) - 1e-9,
            );
            expect(sim.curve[k]?.currentA ?? 0).toBeLessThanOrEqual((sim.curve[k - 1]?.currentA ?? 0) + 1e-9);
          }
        },
      ),
      { numRuns: 30 },
    );
  });

  it('never raises Pmp when more shade is added (property)', () => {
    const cell = fc.record({
      module: fc.integer({ min: 0, max: 2 }),
      cell: fc.integer({ min: 0, max: 59 }),
      fraction: fc.double({ min: 0, max: 1, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.array(cell, { maxLength: 4 }),
        fc.array(cell, { minLength: 1, maxLength: 3 }),
        (some, more) => {
          const less = simulateString({
            module,
            modulesInSeries: 3,
            irradianceWm2: 1000,
            moduleTempC: 25,
            shading: some,
            points: 50,
          });
          const most = simulateString({
            module,
            modulesInSeries: 3,
            irradianceWm2: 1000,
            moduleTempC: 25,
            shading: [...some, ...more],
            points: 50,
          });
          expect(most.pmpW).toBeLessThanOrEqual(less.pmpW * (1 + 1e-9));
        },
      ),
      { numRuns: 30 },
    );
  });

  it('adds voltages at equal current: N modules give N × the Voc and Pmp of one (property)', () => {
    const one = simulateString({
      module,
      modulesInSeries: 1,
      irradianceWm2: 700,
      moduleTempC: 30,
      points: 50,
    });
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 40 }), (n) => {
        const string = simulateString({
          module,
          modulesInSeries: n,
          irradianceWm2: 700,
          moduleTempC: 30,
          points: 50,
        });
        expect(string.vocV / (n * one.vocV)).toBeCloseTo(1, 9);
        expect(string.pmpW / (n * one.pmpW)).toBeCloseTo(1, 6);
        expect(string.iscA).toBeCloseTo(one.iscA, 9);
      }),
      { numRuns: 15 },
    );
  });

  it('lowers Voc with temperature and raises Isc with irradiance (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 1000, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        (g, t) => {
          const base = simulateString({
            module,
            modulesInSeries: 2,
            irradianceWm2: g,
            moduleTempC: t,
            points: 20,
          });
          const warmer = simulateString({
            module,
            modulesInSeries: 2,
            irradianceWm2: g,
            moduleTempC: t + 5,
            points: 20,
          });
          const brighter = simulateString({
            module,
            modulesInSeries: 2,
            irradianceWm2: g * 1.1,
            moduleTempC: t,
            points: 20,
          });
          expect(warmer.vocV).toBeLessThan(base.vocV);
          expect(brighter.iscA).toBeGreaterThan(base.iscA);
        },
      ),
      { numRuns: 20 },
    );
  });

  it('throws for a shaded cell outside the module (programmer error)', () => {
    expect(() =>
      simulateString({
        module,
        modulesInSeries: 2,
        irradianceWm2: 1000,
        moduleTempC: 25,
        shading: [{ module: 0, cell: 60, fraction: 0.5 }],
      }),
    ).toThrow(RangeError);
  });
});
