import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { deSotoReferenceFit } from './desoto-reference-fit.ts';
import { PHYSICS } from './physical-constants.ts';
import { solveSingleDiode } from './solve-single-diode.ts';
import { translateDeSoto } from './translate-desoto.ts';
import type { CurvePoints, ModuleSpec } from './types.ts';

/** Input of {@link expectedString}. */
export type ExpectedStringInput = {
  readonly module: ModuleSpec;
  /** Modules in series in the string (whole number ≥ 1). */
  readonly modulesInSeries: number;
  /** Plane-of-array irradiance, W/m² (> 0 … 2000). */
  readonly irradianceWm2: number;
  /** Module (cell) temperature, °C (−60 … 120). */
  readonly moduleTempC: number;
};

/**
 * What a healthy string should read at the measured irradiance and module temperature.
 *
 * - Isc (A) by the simple translation of pv-field-testing §1.1 (SAPM form):
 *   Isc = Isc_stc·(G/1000)·[1 + α·(Tc − 25)]; a string of modules in series carries one module's Isc.
 * - Voc (V) by §1.1: Voc = N·[Voc_stc + β_abs·(Tc − 25) + a(Tc)·ln(G/1000)], with
 *   a(Tc) = a_ref·Tc/Tref from the De Soto fit of the datasheet (the fitted n, not a guess).
 * - Vmp, Imp, Pmp (V, A, W) from the fitted single-diode model translated by De Soto (§5.3).
 * The simple and single-diode values agree within 0.25 % on Isc and 0.1 % on Voc (§11 items 8–9).
 * Throws a RangeError on invalid input.
 */
export function expectedString(input: ExpectedStringInput): CurvePoints {
  const { module, modulesInSeries, irradianceWm2, moduleTempC } = input;
  assertModuleSpec(module);
  assertNumber(modulesInSeries, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  assertNumber(irradianceWm2, 'irradianceWm2', { greaterThan: 0, max: 2000 });
  assertNumber(moduleTempC, 'moduleTempC', { min: -60, max: 120 });
  const dT = moduleTempC - PHYSICS.stcCellTempC;
  const gRatio = irradianceWm2 / PHYSICS.stcIrradianceWm2;
  const fit = deSotoReferenceFit(module);
  const aV =
    (fit.modifiedIdealityV * (moduleTempC + PHYSICS.zeroCelsiusK)) /
    (PHYSICS.stcCellTempC + PHYSICS.zeroCelsiusK);
  const moduleVocV = module.vocV * (1 + (module.betaVocPctPerC / 100) * dT) + aV * Math.log(gRatio);
  const iscA = module.iscA * gRatio * (1 + (module.alphaIscPctPerC / 100) * dT);
  const mpp = solveSingleDiode(
    translateDeSoto(fit, (module.alphaIscPctPerC / 100) * module.iscA, {
      irradianceWm2,
      cellTempC: moduleTempC,
    }),
  );
  return {
    vocV: modulesInSeries * moduleVocV,
    iscA,
    vmpV: modulesInSeries * mpp.vmpV,
    impA: mpp.impA,
    pmpW: modulesInSeries * mpp.pmpW,
  };
}
