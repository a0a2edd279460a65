import { assertNumber } from './assert-number.ts';
import type { ModuleSpec } from './types.ts';

/**
 * Throws a RangeError when a module datasheet cannot describe a crystalline module:
 * non-positive ratings, Vmp ≥ Voc, Imp ≥ Isc, non-integer cell or diode counts, cells that do not
 * split evenly over the bypass diodes. The zod schema in `@stringfield/shared` gives users the
 * same rules with friendlier messages.
 */
export function assertModuleSpec(module: ModuleSpec): void {
  assertNumber(module.pmaxW, 'module.pmaxW', { greaterThan: 0 });
  assertNumber(module.vocV, 'module.vocV', { greaterThan: 0 });
  assertNumber(module.iscA, 'module.iscA', { greaterThan: 0 });
  assertNumber(module.vmpV, 'module.vmpV', { greaterThan: 0, lessThan: module.vocV });
  assertNumber(module.impA, 'module.impA', { greaterThan: 0, lessThan: module.iscA });
  assertNumber(module.alphaIscPctPerC, 'module.alphaIscPctPerC', { min: -1, max: 1 });
  assertNumber(module.betaVocPctPerC, 'module.betaVocPctPerC', { min: -2, lessThan: 0 });
  assertNumber(module.gammaPmaxPctPerC, 'module.gammaPmaxPctPerC', { min: -2, max: 0 });
  assertNumber(module.cellsInSeries, 'module.cellsInSeries', { integer: true, min: 1 });
  assertNumber(module.bypassDiodes, 'module.bypassDiodes', {
    integer: true,
    min: 1,
    max: module.cellsInSeries,
  });
  if (module.cellsInSeries % module.bypassDiodes !== 0) {
    throw new RangeError(
      `module.cellsInSeries (${module.cellsInSeries}) must split evenly over module.bypassDiodes (${module.bypassDiodes})`,
    );
  }
  if (module.noctC !== undefined) assertNumber(module.noctC, 'module.noctC', { min: 20, max: 80 });
}
