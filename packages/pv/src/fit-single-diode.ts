import { assertNumber } from './assert-number.ts';
import { PHYSICS } from './physical-constants.ts';
import { deSotoReferenceFit } from './desoto-reference-fit.ts';
import { translateDeSoto } from './translate-desoto.ts';
import type { ModuleSpec, SingleDiodeParams } from './types.ts';

/** Result of {@link fitSingleDiode}: the five parameters plus the ideality factor n. */
export type SingleDiodeFit = SingleDiodeParams & {
  /** n, diode ideality factor (dimensionless, a = n·Ns·k·Tc/q). */
  readonly idealityFactor: number;
  /** Cell temperature the parameters apply to, °C (irradiance is always 1000 W/m²). */
  readonly cellTempC: number;
  /** The published method used. */
  readonly method: 'De Soto, Klein & Beckman 2006';
};

/**
 * Fits the five single-diode parameters to a module datasheet by the method of De Soto, Klein &
 * Beckman (Solar Energy 80, 2006; Duffie & Beckman 4th ed. ch. 23; as pvlib `fit_desoto`,
 * pv-field-testing §5.4): five equations — short circuit, open circuit, the maximum-power point,
 * dP/dV = 0 there (D&B eq. 23.2.6), and open circuit at Tref + 2 K using β — solved for IL, I0, Rs,
 * Rsh and a by a damped Newton method (on ln I0 and ln Rsh) from the D&B initial guesses.
 *
 * The fit reproduces the datasheet's Isc, Voc, Vmp and Imp (to < 1e-6 relative when it converges).
 * `tempC` (default 25 °C) returns the parameters at 1000 W/m² and that cell temperature, translated
 * by De Soto's equations. Results are memoised per datasheet (pure function, bounded cache).
 * Throws a RangeError on an invalid datasheet or when the equations have no physical solution
 * (e.g. Rs < 0 for an implausible Vmp/Imp pair).
 */
export function fitSingleDiode(
  module: ModuleSpec,
  options: { readonly tempC?: number } = {},
): SingleDiodeFit {
  const tempC = options.tempC ?? PHYSICS.stcCellTempC;
  assertNumber(tempC, 'tempC', { min: -60, max: 120 });
  const reference = deSotoReferenceFit(module);
  const params =
    tempC === PHYSICS.stcCellTempC
      ? reference
      : translateDeSoto(reference, (module.alphaIscPctPerC / 100) * module.iscA, {
          irradianceWm2: PHYSICS.stcIrradianceWm2,
          cellTempC: tempC,
        });
  const vth = PHYSICS.boltzmannOverChargeVPerK * (tempC + PHYSICS.zeroCelsiusK);
  return {
    ...params,
    idealityFactor: params.modifiedIdealityV / (module.cellsInSeries * vth),
    cellTempC: tempC,
    method: 'De Soto, Klein & Beckman 2006',
  };
}
