import { describe, expect, it } from 'vitest';
import { solveSingleDiode } from './solve-single-diode.ts';
import { PVLIB_SDM } from './test-fixtures.ts';

describe('solveSingleDiode', () => {
  const result = solveSingleDiode(PVLIB_SDM);
  it.each([
    // pvlib test_singlediode_floats, atol 1e-6 (pv-field-testing §11 item 2)
    { key: 'iscA', value: 6.965172322 },
    { key: 'vocV', value: 8.106300147 },
    { key: 'impA', value: 6.13626736 },
    { key: 'vmpV', value: 6.224339375 },
    { key: 'pmpW', value: 38.19421055 },
  ] as const)('finds $key = $value (pvlib test_singlediode_floats)', ({ key, value }) => {
    expect(Math.abs(result[key] - value)).toBeLessThan(1e-6);
  });

  it('returns zeros for a dark device (IL = 0)', () => {
    expect(solveSingleDiode({ ...PVLIB_SDM, photoCurrentA: 0 }).pmpW).toBe(0);
  });

  it('throws on a negative series resistance (programmer error)', () => {
    expect(() => solveSingleDiode({ ...PVLIB_SDM, seriesOhm: -1 })).toThrow(RangeError);
  });
});
