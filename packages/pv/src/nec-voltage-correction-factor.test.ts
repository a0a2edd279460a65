import { describe, expect, it } from 'vitest';
import { necVoltageCorrectionFactor } from './nec-voltage-correction-factor.ts';

describe('necVoltageCorrectionFactor (NEC Table 690.7(A))', () => {
  it.each([
    // NEC 2023 Table 690.7(A) (pv-field-testing §11 item 17)
    { t: -10, factor: 1.14 },
    { t: -40, factor: 1.25 },
    { t: 20, factor: 1.02 },
    { t: -26, factor: 1.21 },
    // NEC 2023 Table 690.7(A) band edges (pv-field-testing §4.1)
    { t: 24, factor: 1.02 },
    { t: 19, factor: 1.04 },
    { t: 0, factor: 1.1 },
    { t: -1, factor: 1.12 },
    { t: -5, factor: 1.12 },
    { t: -6, factor: 1.14 },
    { t: -35, factor: 1.23 },
    // rounding rule documented in pv-field-testing §4.1: −0.5 °C falls in the "−1 to −5" row
    { t: -0.5, factor: 1.12 },
    // no correction at 25 °C and above (the table corrects below 25 °C)
    { t: 25, factor: 1 },
  ])('gives $factor at $t °C', ({ t, factor }) => {
    expect(necVoltageCorrectionFactor(t)).toBe(factor);
  });

  it('throws below −40 °C, where the table has no row (NEC 690.7(A), §4.1)', () => {
    expect(() => necVoltageCorrectionFactor(-41)).toThrow(/coefficient/);
  });
});
