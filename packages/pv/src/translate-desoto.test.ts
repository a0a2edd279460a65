import { describe, expect, it } from 'vitest';
import { translateDeSoto } from './translate-desoto.ts';

// De Soto fit of the published 60-cell datasheet (pvlib test_fit_desoto, pv-field-testing §11 item 6).
const reference = {
  photoCurrentA: 9.45232,
  saturationCurrentA: 3.2246e-10,
  seriesOhm: 0.297814,
  shuntOhm: 125.798,
  modifiedIdealityV: 1.59128,
};

describe('translateDeSoto', () => {
  const hot = translateDeSoto(reference, 0.005658, { irradianceWm2: 800, cellTempC: 45 });
  it('scales a with absolute temperature: 1.59128 × 318.15/298.15 (De Soto 2006, §5.3)', () => {
    expect(hot.modifiedIdealityV).toBeCloseTo((1.59128 * 318.15) / 298.15, 12);
  });
  it('gives IL = 0.8 × (9.45232 + 0.005658 × 20) (De Soto 2006, §5.3)', () => {
    expect(hot.photoCurrentA).toBeCloseTo(0.8 * (9.45232 + 0.005658 * 20), 12);
  });
  it('raises I0 with temperature by the T³·exp[Eg_ref/(k·Tref) − Eg/(k·Tc)] law with Eg = 1.121 eV·(1 − 0.0002677·ΔT) (De Soto 2006, §5.3)', () => {
    const ratio = hot.saturationCurrentA / reference.saturationCurrentA;
    const k = 8.617333262e-5;
    const eg = 1.121 * (1 - 0.0002677 * 20);
    expect(ratio).toBeCloseTo((318.15 / 298.15) ** 3 * Math.exp(1.121 / (k * 298.15) - eg / (k * 318.15)), 6);
    expect(ratio).toBeGreaterThan(1);
  });
  it('keeps Rs and scales Rsh by 1000/G', () => {
    expect(hot.seriesOhm).toBe(0.297814);
    expect(hot.shuntOhm).toBeCloseTo(125.798 * 1.25, 10);
  });
});
