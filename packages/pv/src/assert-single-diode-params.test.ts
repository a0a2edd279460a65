import { describe, expect, it } from 'vitest';
import { assertSingleDiodeParams } from './assert-single-diode-params.ts';
import { PVLIB_SDM } from './test-fixtures.ts';

describe('assertSingleDiodeParams', () => {
  it('accepts the pvlib float case and an infinite shunt', () => {
    expect(() => assertSingleDiodeParams(PVLIB_SDM)).not.toThrow();
    expect(() => assertSingleDiodeParams({ ...PVLIB_SDM, shuntOhm: Infinity })).not.toThrow();
  });

  it('rejects a zero saturation current', () => {
    expect(() => assertSingleDiodeParams({ ...PVLIB_SDM, saturationCurrentA: 0 })).toThrow(RangeError);
  });
});
