import { assertNumber } from './assert-number.ts';
import type { SingleDiodeParams } from './types.ts';

/** Throws a RangeError unless the five single-diode parameters are physically meaningful. */
export function assertSingleDiodeParams(params: SingleDiodeParams): void {
  assertNumber(params.photoCurrentA, 'photoCurrentA', { min: 0 });
  assertNumber(params.saturationCurrentA, 'saturationCurrentA', { greaterThan: 0 });
  assertNumber(params.seriesOhm, 'seriesOhm', { min: 0 });
  if (params.shuntOhm !== Infinity) assertNumber(params.shuntOhm, 'shuntOhm', { greaterThan: 0 });
  assertNumber(params.modifiedIdealityV, 'modifiedIdealityV', { greaterThan: 0 });
}
