import type { ModuleSpec } from '@stringfield/pv';
import type { ModuleModel } from '@stringfield/shared';

/** A string as the browser-side engine needs it. */
export type StringSpec = {
  stringId: number;
  label: string;
  modulesInSeries: number;
  /** Maker and model, for the screen. */
  moduleName: string;
  module: ModuleSpec;
};

/** The datasheet as `@stringfield/pv` reads it (NOCT left out when unknown). */
export function toModuleSpec(m: Pick<ModuleModel, keyof ModuleSpec>): ModuleSpec {
  return {
    pmaxW: m.pmaxW,
    vocV: m.vocV,
    iscA: m.iscA,
    vmpV: m.vmpV,
    impA: m.impA,
    alphaIscPctPerC: m.alphaIscPctPerC,
    betaVocPctPerC: m.betaVocPctPerC,
    gammaPmaxPctPerC: m.gammaPmaxPctPerC,
    cellsInSeries: m.cellsInSeries,
    bypassDiodes: m.bypassDiodes,
    ...(m.noctC === null || m.noctC === undefined ? {} : { noctC: m.noctC }),
  };
}
