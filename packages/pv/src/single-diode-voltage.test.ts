import { describe, expect, it } from 'vitest';
import { singleDiodeVoltage } from './single-diode-voltage.ts';
import { PVLIB_SDM } from './test-fixtures.ts';

describe('singleDiodeVoltage', () => {
  it.each([
    // pvlib test_singlediode_floats (pv-field-testing §11 item 2)
    { name: 'Voc of the pvlib float case', params: PVLIB_SDM, currentA: 0, voltageV: 8.106300147 },
    // pvlib fixture_v_from_i (§11 item 3)
    { name: 'V at 3 A of the pvlib float case', params: PVLIB_SDM, currentA: 3, voltageV: 7.504987519 },
    // pvlib fixture_v_from_i, large Lambert argument (§11 item 4)
    {
      name: 'Voc with a large Lambert argument',
      params: {
        shuntOhm: 500,
        seriesOhm: 10,
        modifiedIdealityV: 4.06,
        saturationCurrentA: 6e-10,
        photoCurrentA: 1.2,
      },
      currentA: 0,
      voltageV: 86.320000494,
    },
    // pvlib fixture_v_from_i, overflow path needing the log-domain W (§11 item 5)
    {
      name: 'Voc on the overflow path',
      params: {
        shuntOhm: 190,
        seriesOhm: 1.065,
        modifiedIdealityV: 2.89,
        saturationCurrentA: 7.05196029e-8,
        photoCurrentA: 10.491262,
      },
      currentA: 0,
      voltageV: 54.303958834,
    },
  ])('gives $voltageV V for $name', ({ params, currentA, voltageV }) => {
    expect(Math.abs(singleDiodeVoltage(params, currentA) - voltageV)).toBeLessThan(1e-6);
  });

  it('falls to V = a·ln(1 + (IL − I)/I0) − I·Rs when Rsh is infinite (pv-field-testing §5.2 special case)', () => {
    const p = { ...PVLIB_SDM, shuntOhm: Infinity };
    expect(singleDiodeVoltage(p, 3)).toBeCloseTo(0.5 * Math.log1p(4 / 6e-7) - 0.3, 12);
  });
});
