import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bishopDiodeVoltage } from './bishop-diode-voltage.ts';
import { singleDiodeVoltage } from './single-diode-voltage.ts';

// pvlib's partial-shading example cell (pv-field-testing §6.1): IL 8.24 A, I0 2.36e-9 A, a = 1.3·Vth, Rsh 1000 Ω, Rs 0.00181 Ω.
const cell = {
  photoCurrentA: 8.24,
  saturationCurrentA: 2.36e-9,
  seriesOhm: 0.00181,
  shuntOhm: 1000,
  modifiedIdealityV: 1.3 * 0.025693,
};
const reverse = { breakdownV: -15, a: 2e-3, m: 3 };
const bishopCurrent = (vd: number) =>
  cell.photoCurrentA -
  cell.saturationCurrentA * Math.expm1(vd / cell.modifiedIdealityV) -
  vd / cell.shuntOhm -
  reverse.a * (vd / cell.shuntOhm) * (1 - vd / reverse.breakdownV) ** -reverse.m;

describe('bishopDiodeVoltage', () => {
  it('satisfies Bishop’s equation at any current up to 3 × IL (property, Bishop 1988 as pvlib bishop88)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 25, noNaN: true }),
        fc.double({ min: -14, max: 0.7, noNaN: true }),
        (currentA, guess) => {
          const vd = bishopDiodeVoltage(cell, reverse, currentA, guess);
          expect(bishopCurrent(vd)).toBeCloseTo(currentA, 7);
          expect(vd).toBeGreaterThan(reverse.breakdownV);
        },
      ),
    );
  });

  it('matches the Lambert-W single-diode voltage when breakdown is off (independent path, §5.2)', () => {
    const vd = bishopDiodeVoltage(cell, { ...reverse, a: 0 }, 5);
    expect(vd - 5 * cell.seriesOhm).toBeCloseTo(singleDiodeVoltage(cell, 5), 10);
  });

  it('goes into reverse bias above the photocurrent and stays above the −15 V breakdown (c-Si breakdown some −15 V, trade fact)', () => {
    const vd = bishopDiodeVoltage(cell, reverse, 20);
    expect(vd).toBeLessThan(0);
    expect(vd).toBeGreaterThan(-15);
  });
});
