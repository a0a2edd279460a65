import type { ModuleSpec } from '@stringfield/pv';
import type { ModuleModel } from '@stringfield/shared';

/** A library datasheet as the PV engine takes it (NOCT absent rather than null). */
export function toModuleSpec(m: ModuleModel): ModuleSpec {
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
    ...(m.noctC === null ? {} : { noctC: m.noctC }),
  };
}
