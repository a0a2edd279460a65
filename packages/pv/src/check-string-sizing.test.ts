import { describe, expect, it } from 'vitest';
import { checkStringSizing, type StringSizingInput } from './check-string-sizing.ts';
import { buildModule } from './test-fixtures.ts';

const base: StringSizingInput = {
  module: buildModule(),
  modulesInSeries: 20,
  stringsInParallel: 1,
  inverterInput: {
    maxDcV: 1000,
    mpptMinV: 400,
    mpptMaxV: 850,
    maxInputA: 12,
    maxShortCircuitA: 15,
    maxPowerW: 6000,
  },
  site: { lowestAmbientC: -10, highestAmbientC: 40 },
};
const check = (input: StringSizingInput, name: string) =>
  checkStringSizing(input).checks.find((c) => c.name === name);

describe('checkStringSizing', () => {
  it('passes a 20 × 38.3 V string on a 1000 V inverter', () => {
    expect(checkStringSizing(base).ok).toBe(true);
  });

  it('computes the cold Voc by NEC 690.7(A)(1): 862.52 V at −10 °C (pv-field-testing §11 item 18)', () => {
    expect(check(base, 'COLD_VOC_BELOW_MAX_DC')?.value).toBeCloseTo(862.52, 2);
  });

  it('fails cold Voc when 24 modules would reach 1035 V on an inverter rated 1000 V (24 × 38.3 × 1.126, §11 item 18 arithmetic)', () => {
    const c = check({ ...base, modulesInSeries: 24 }, 'COLD_VOC_BELOW_MAX_DC');
    expect(c?.ok).toBe(false);
    expect(c?.value).toBeCloseTo(24 * 38.3 * 1.126, 6);
    expect(c?.message).toMatch(/remove modules/);
  });

  it('uses Isc × 1.25 = 11.7875 A and × 1.5625 = 14.734 A for one string (NEC 690.8, pv-field-testing §11 item 19)', () => {
    const r = checkStringSizing(base);
    expect(r.maxCircuitCurrentA).toBeCloseTo(11.7875, 4);
    expect(r.minConductorAmpacityA).toBeCloseTo(14.734, 3);
  });

  it('fails the short-circuit limit with two strings (2 × 11.7875 A > 15 A, NEC 690.8(A)(1))', () => {
    expect(check({ ...base, stringsInParallel: 2 }, 'MAX_CIRCUIT_CURRENT_WITHIN_LIMIT')?.ok).toBe(false);
  });

  it('fails the hot MPPT minimum for a 12-module string on a 400 V minimum (hot Vmp well below 12 × 31 V)', () => {
    const c = check({ ...base, modulesInSeries: 12 }, 'HOT_VMP_ABOVE_MPPT_MIN');
    expect(c?.ok).toBe(false);
    expect(c?.value).toBeLessThan(12 * 31);
  });

  it('checks the MPPT minimum again with one substring bypassed, a lower value (one substring ≈ 1/(3·N) of Vmp)', () => {
    const normal = check(base, 'HOT_VMP_ABOVE_MPPT_MIN')?.value ?? 0;
    const bypassed = check(base, 'HOT_VMP_ONE_SUBSTRING_BYPASSED_ABOVE_MPPT_MIN')?.value ?? 0;
    expect(normal - bypassed).toBeGreaterThan(normal / 60);
  });

  it('flags clipping when the STC array power (5400 W = 20 × 270.01 W) exceeds a 5000 W input', () => {
    const c = check(
      { ...base, inverterInput: { ...base.inverterInput, maxPowerW: 5000 } },
      'POWER_WITHIN_ENVELOPE',
    );
    expect(c?.ok).toBe(false);
    expect(c?.value).toBeCloseTo(5400.2, 1);
  });

  it('limits the power envelope by current × voltage (constant-power curve P/V): 8 A × 620 V = 4960 W', () => {
    const c = check(
      { ...base, inverterInput: { ...base.inverterInput, maxInputA: 8, maxShortCircuitA: 20 } },
      'POWER_WITHIN_ENVELOPE',
    );
    expect(c?.limit).toBeCloseTo(8 * 620, 0);
  });
});
