import { assertNumber } from './assert-number.ts';
import { deSotoReferenceFit } from './desoto-reference-fit.ts';
import { translateDeSoto, type OperatingCondition } from './translate-desoto.ts';
import type { ModuleSpec, SingleDiodeParams } from './types.ts';

/**
 * Single-diode parameters of one module at an operating condition: the De Soto fit of the
 * datasheet (see `fitSingleDiode`) translated to the irradiance (W/m², > 0) and cell
 * temperature (°C) by De Soto's equations (pv-field-testing §5.3).
 */
export function singleDiodeParamsAt(module: ModuleSpec, condition: OperatingCondition): SingleDiodeParams {
  assertNumber(condition.irradianceWm2, 'irradianceWm2', { greaterThan: 0, max: 2000 });
  assertNumber(condition.cellTempC, 'cellTempC', { min: -60, max: 120 });
  const reference = deSotoReferenceFit(module);
  return translateDeSoto(reference, (module.alphaIscPctPerC / 100) * module.iscA, condition);
}
