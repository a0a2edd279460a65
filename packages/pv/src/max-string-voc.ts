import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { necVoltageCorrectionFactor } from './nec-voltage-correction-factor.ts';
import type { ModuleSpec } from './types.ts';

/** Input of {@link maxStringVoc}. */
export type MaxStringVocInput = {
  readonly module: ModuleSpec;
  /** Modules in series (whole number ≥ 1). */
  readonly modulesInSeries: number;
  /** Lowest expected ambient temperature, °C (ASHRAE extreme annual mean minimum design dry bulb, by convention). */
  readonly lowestAmbientC: number;
  /** `'coefficient'`: NEC 690.7(A)(1) with the module's β; `'table'`: NEC Table 690.7(A). */
  readonly method: 'coefficient' | 'table';
};

/** Result of {@link maxStringVoc}. */
export type MaxStringVoc = {
  /** Maximum string open-circuit voltage, V. */
  readonly maxVocV: number;
  /** Factor applied to the summed rated Voc (dimensionless, ≥ 1). */
  readonly correctionFactor: number;
  readonly method: 'coefficient' | 'table';
};

/**
 * Maximum PV source-circuit DC voltage per NEC 690.7(A) (pv-field-testing §4.1):
 * coefficient method Vmax = N·Voc_stc·[1 + β·(Tmin − 25)] (β in %/°C ÷ 100; the factor is not
 * allowed below 1), or table method Vmax = N·Voc_stc·factor(Tmin). Local codes and the authority
 * having jurisdiction rule. Throws a RangeError on invalid input or (table) below −40 °C.
 */
export function maxStringVoc(input: MaxStringVocInput): MaxStringVoc {
  assertModuleSpec(input.module);
  assertNumber(input.modulesInSeries, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  assertNumber(input.lowestAmbientC, 'lowestAmbientC', { min: -80, max: 60 });
  const correctionFactor =
    input.method === 'table'
      ? necVoltageCorrectionFactor(input.lowestAmbientC)
      : Math.max(1, 1 + (input.module.betaVocPctPerC / 100) * (input.lowestAmbientC - 25));
  return {
    maxVocV: input.modulesInSeries * input.module.vocV * correctionFactor,
    correctionFactor,
    method: input.method,
  };
}
