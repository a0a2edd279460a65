import { PHYSICS } from './physical-constants.ts';
import type { SingleDiodeParams } from './types.ts';

/** Operating condition for {@link translateDeSoto}. */
export type OperatingCondition = {
  /** Plane-of-array irradiance, W/m² (> 0). */
  readonly irradianceWm2: number;
  /** Cell temperature, °C. */
  readonly cellTempC: number;
};

/**
 * Translates single-diode parameters fitted at STC to another irradiance and cell temperature,
 * after De Soto, Klein & Beckman (Solar Energy 80, 2006, 78–88; as in pvlib calcparams_desoto;
 * pv-field-testing §5.3): a ∝ Tc(K); IL = G/1000·[IL_ref + α·(Tc − 25)];
 * I0 = I0_ref·(Tc/Tref)³·exp[Eg_ref/(k·Tref) − Eg/(k·Tc)] with Eg = 1.121 eV·[1 − 0.0002677·(Tc − 25)];
 * Rsh = Rsh_ref·1000/G; Rs constant. `alphaIscAPerC` is the absolute Isc coefficient in A/K.
 * Not validated (hot path): callers pass G > 0.
 */
export function translateDeSoto(
  reference: SingleDiodeParams,
  alphaIscAPerC: number,
  condition: OperatingCondition,
): SingleDiodeParams {
  const k = PHYSICS.boltzmannOverChargeVPerK;
  const trefK = PHYSICS.stcCellTempC + PHYSICS.zeroCelsiusK;
  const tcK = condition.cellTempC + PHYSICS.zeroCelsiusK;
  const dT = condition.cellTempC - PHYSICS.stcCellTempC;
  const egRef = PHYSICS.siliconBandgapEv;
  const eg = egRef * (1 + PHYSICS.siliconBandgapPerK * dT);
  const ratio = tcK / trefK;
  return {
    photoCurrentA:
      (condition.irradianceWm2 / PHYSICS.stcIrradianceWm2) * (reference.photoCurrentA + alphaIscAPerC * dT),
    saturationCurrentA:
      reference.saturationCurrentA * ratio ** 3 * Math.exp(egRef / (k * trefK) - eg / (k * tcK)),
    seriesOhm: reference.seriesOhm,
    shuntOhm: (reference.shuntOhm * PHYSICS.stcIrradianceWm2) / condition.irradianceWm2,
    modifiedIdealityV: reference.modifiedIdealityV * ratio,
  };
}
