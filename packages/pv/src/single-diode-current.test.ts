import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { singleDiodeCurrent } from './single-diode-current.ts';
import { singleDiodeVoltage } from './single-diode-voltage.ts';
import { PVLIB_SDM } from './test-fixtures.ts';

describe('singleDiodeCurrent', () => {
  it('gives Isc 6.965172322 A at V = 0 (pvlib test_singlediode_floats, pv-field-testing §11 item 2)', () => {
    expect(singleDiodeCurrent(PVLIB_SDM, 0)).toBeCloseTo(6.965172322, 6);
  });

  it('gives 6.136267360 A at Vmp 6.224339375 V (pvlib test_singlediode_floats, §11 item 2)', () => {
    expect(singleDiodeCurrent(PVLIB_SDM, 6.224339375)).toBeCloseTo(6.13626736, 6);
  });

  it('gives 3 A at the 7.504987519 V that pvlib finds for 3 A (pvlib fixture_v_from_i, §11 item 3)', () => {
    expect(singleDiodeCurrent(PVLIB_SDM, 7.504987519)).toBeCloseTo(3, 6);
  });

  it('falls to the Rs = 0 closed form I = IL − I0·(e^(V/a) − 1) − V/Rsh (pv-field-testing §5.2 special case)', () => {
    const p = { ...PVLIB_SDM, seriesOhm: 0 };
    const v = 7;
    expect(singleDiodeCurrent(p, v)).toBeCloseTo(7 - 6e-7 * Math.expm1(v / 0.5) - v / 20, 12);
  });

  it('decreases with voltage everywhere (property: the SDM I-V curve is monotone)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 8.1, noNaN: true }),
        fc.double({ min: 1e-4, max: 1, noNaN: true }),
        (v, dv) => {
          expect(singleDiodeCurrent(PVLIB_SDM, v + dv)).toBeLessThan(singleDiodeCurrent(PVLIB_SDM, v));
        },
      ),
    );
  });

  it('is the inverse of singleDiodeVoltage (property: I(V(I)) = I)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 6.9, noNaN: true }), (i) => {
        expect(singleDiodeCurrent(PVLIB_SDM, singleDiodeVoltage(PVLIB_SDM, i))).toBeCloseTo(i, 9);
      }),
    );
  });
});
