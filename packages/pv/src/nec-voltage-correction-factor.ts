import { assertNumber } from './assert-number.ts';

// NEC (NFPA 70) Table 690.7(A), crystalline and multicrystalline silicon, by band lower bound in °C
// (pv-field-testing §4.1, confirmed across several independent public copies of NEC 2017 and 2023).
const BANDS: readonly (readonly [lowerBoundC: number, factor: number])[] = [
  [20, 1.02],
  [15, 1.04],
  [10, 1.06],
  [5, 1.08],
  [0, 1.1],
  [-5, 1.12],
  [-10, 1.14],
  [-15, 1.16],
  [-20, 1.18],
  [-25, 1.2],
  [-30, 1.21],
  [-35, 1.23],
  [-40, 1.25],
];

/**
 * Voltage correction factor of NEC Table 690.7(A) for crystalline and multicrystalline silicon
 * modules at the lowest expected ambient temperature (°C). Returns 1 at 25 °C and above (the table
 * only corrects below 25 °C). The bands are integer °C; a non-integer temperature falls in the
 * colder band (−0.5 °C uses the "−1 to −5" row, 1.12). Throws a RangeError below −40 °C, where the
 * table has no row and the coefficient method of 690.7(A)(1) is required.
 */
export function necVoltageCorrectionFactor(lowestAmbientC: number): number {
  assertNumber(lowestAmbientC, 'lowestAmbientC', { max: 60 });
  if (lowestAmbientC >= 25) return 1;
  for (const [lowerBoundC, factor] of BANDS) {
    if (lowestAmbientC >= lowerBoundC) return factor;
  }
  throw new RangeError(
    `NEC Table 690.7(A) has no row below -40 °C (got ${lowestAmbientC} °C): use the module's coefficient (690.7(A)(1))`,
  );
}
