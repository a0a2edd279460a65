import { describe, expect, it } from 'vitest';
import { cellTemperature } from './cell-temperature.ts';

describe('cellTemperature', () => {
  it.each([
    // NOCT definition: 800 W/m², 20 °C ambient gives NOCT itself (pv-field-testing §11 item 16)
    { ambientC: 20, irradianceWm2: 800, noctC: 45, cellC: 45.0 },
    // NOCT model at 1000 W/m², 25 °C (§11 item 16 [derived from the confirmed formula])
    { ambientC: 25, irradianceWm2: 1000, noctC: 45, cellC: 56.25 },
    // no sun, no rise (formula of §1.2)
    { ambientC: 12, irradianceWm2: 0, noctC: 45, cellC: 12 },
  ])(
    'NOCT model: $ambientC °C ambient, $irradianceWm2 W/m², NOCT $noctC °C → $cellC °C',
    ({ ambientC, irradianceWm2, noctC, cellC }) => {
      expect(cellTemperature({ ambientC, irradianceWm2, noctC })).toBeCloseTo(cellC, 10);
    },
  );

  it('Faiman model: 1000 W/m², 10 °C, 1 m/s → 41.40704 °C (pvlib temperature.faiman, pv-field-testing §11 item 14)', () => {
    expect(cellTemperature({ ambientC: 10, irradianceWm2: 1000, windMs: 1, model: 'faiman' })).toBeCloseTo(
      41.40704,
      4,
    );
  });

  it('Faiman model cools with wind (physics: U rises with wind speed)', () => {
    const calm = cellTemperature({ ambientC: 10, irradianceWm2: 1000, windMs: 0, model: 'faiman' });
    const windy = cellTemperature({ ambientC: 10, irradianceWm2: 1000, windMs: 5, model: 'faiman' });
    expect(windy).toBeLessThan(calm);
  });

  it('throws when the NOCT model has no NOCT (programmer error)', () => {
    expect(() => cellTemperature({ ambientC: 10, irradianceWm2: 800 })).toThrow(RangeError);
  });
});
