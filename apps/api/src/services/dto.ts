import type {
  CombinerBox as CombinerBoxDto,
  Inverter as InverterDto,
  InverterModel as InverterModelDto,
  ModuleModel as ModuleModelDto,
  PvString as PvStringDto,
} from '@stringfield/shared';
import type { CombinerBox, Inverter, InverterModel, ModuleModel, PvString } from '../models/index.ts';

export function moduleModelDto(m: ModuleModel, stringCount = 0): ModuleModelDto {
  return {
    id: m.id,
    maker: m.maker,
    model: m.model,
    cellTechnology: m.cellTechnology as ModuleModelDto['cellTechnology'],
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
    noctC: m.noctC,
    isArchived: m.isArchived,
    stringCount,
  };
}

export function inverterModelDto(m: InverterModel, inverterCount = 0): InverterModelDto {
  return {
    id: m.id,
    maker: m.maker,
    model: m.model,
    maxDcV: m.maxDcV,
    mpptMinV: m.mpptMinV,
    mpptMaxV: m.mpptMaxV,
    startV: m.startV,
    mpptInputs: m.mpptInputs,
    maxInputA: m.maxInputA,
    maxInputIscA: m.maxInputIscA,
    ratedAcW: m.ratedAcW,
    maxDcW: m.maxDcW,
    isArchived: m.isArchived,
    inverterCount,
  };
}

export function inverterDto(i: Inverter, stringCount = 0): InverterDto {
  return {
    id: i.id,
    siteId: i.siteId,
    tag: i.tag,
    serial: i.serial,
    inverterModelId: i.inverterModelId,
    inverterModel: i.inverterModel ? `${i.inverterModel.maker} ${i.inverterModel.model}` : '',
    mpptInputs: i.inverterModel?.mpptInputs ?? 0,
    isArchived: i.isArchived,
    stringCount,
  };
}

export function combinerBoxDto(c: CombinerBox, stringCount = 0): CombinerBoxDto {
  return { id: c.id, siteId: c.siteId, tag: c.tag, fuseRatingA: c.fuseRatingA, isArchived: c.isArchived, stringCount };
}

export function pvStringDto(s: PvString, sizingFailures: string[]): PvStringDto {
  return {
    id: s.id,
    siteId: s.siteId,
    label: s.label,
    inverterId: s.inverterId,
    inverterTag: s.inverter?.tag ?? '',
    mpptInput: s.mpptInput,
    combinerBoxId: s.combinerBoxId,
    combinerTag: s.combinerBox?.tag ?? null,
    combinerPosition: s.combinerPosition,
    moduleModelId: s.moduleModelId,
    moduleModel: s.moduleModel ? s.moduleModel.model : '',
    modulesInSeries: s.modulesInSeries,
    stringsInParallel: s.stringsInParallel,
    commissionedOn: s.commissionedOn,
    notes: s.notes,
    isArchived: s.isArchived,
    sizingFailures,
  };
}
