import { QueryTypes } from 'sequelize';
import { checkStringSizing, type SizingCheck as PvSizingCheck } from '@stringfield/pv';
import { sizingCheckLabels, type SizingCheck } from '@stringfield/shared';
import { InverterModel, ModuleModel, Site, sequelize } from '../models/index.ts';

type SizingInputs = {
  moduleModel: ModuleModel;
  inverterModel: InverterModel;
  site: Pick<Site, 'lowestAmbientC' | 'highestAmbientC' | 'designIrradianceWm2'>;
  modulesInSeries: number;
  stringsInParallel: number;
};

function toDto(c: PvSizingCheck): SizingCheck {
  return { code: c.name, label: sizingCheckLabels[c.name] ?? c.name, ok: c.ok, value: c.value, limit: c.limit, unit: c.unit, message: c.message };
}

/** The named string-sizing checks of packages/pv for one string on its inverter input at its site. */
export function sizingChecks(i: SizingInputs): SizingCheck[] {
  const inv = i.inverterModel;
  return checkStringSizing({
    module: i.moduleModel.toSpec(),
    modulesInSeries: i.modulesInSeries,
    stringsInParallel: i.stringsInParallel,
    inverterInput: {
      maxDcV: inv.maxDcV,
      mpptMinV: inv.mpptMinV,
      mpptMaxV: inv.mpptMaxV,
      startV: inv.startV,
      maxInputA: inv.maxInputA,
      maxShortCircuitA: inv.maxInputIscA,
      // The datasheet gives the inverter's DC power; each MPPT input is taken to carry an equal share.
      maxPowerW: inv.maxDcW / inv.mpptInputs,
    },
    site: {
      lowestAmbientC: i.site.lowestAmbientC,
      highestAmbientC: i.site.highestAmbientC,
      designIrradianceWm2: i.site.designIrradianceWm2,
    },
  }).checks.map(toDto);
}

export type ComboFailures = {
  siteId: number;
  moduleModelId: number;
  inverterModelId: number;
  modulesInSeries: number;
  stringsInParallel: number;
  count: number;
  failures: string[];
};

/**
 * Strings that share site, module model, inverter model, length and parallel count size identically,
 * so sizing is computed once per such combination (a 600-string site has a handful).
 */
export async function sizingFailuresByCombo(siteIds: number[]): Promise<ComboFailures[]> {
  if (siteIds.length === 0) return [];
  const combos = await sequelize.query<{
    site_id: number;
    module_model_id: number;
    inverter_model_id: number;
    modules_in_series: number;
    strings_in_parallel: number;
    n: number;
  }>(
    `SELECT s.site_id, s.module_model_id, i.inverter_model_id, s.modules_in_series, s.strings_in_parallel, COUNT(*) AS n
       FROM pv_strings s JOIN inverters i ON i.id = s.inverter_id
      WHERE s.site_id IN (:ids) AND s.is_archived = 0
      GROUP BY s.site_id, s.module_model_id, i.inverter_model_id, s.modules_in_series, s.strings_in_parallel`,
    { replacements: { ids: siteIds }, type: QueryTypes.SELECT },
  );
  if (combos.length === 0) return [];
  const [sites, modules, inverters] = await Promise.all([
    Site.findAll({ where: { id: [...new Set(combos.map((c) => c.site_id))] } }),
    ModuleModel.findAll({ where: { id: [...new Set(combos.map((c) => c.module_model_id))] } }),
    InverterModel.findAll({ where: { id: [...new Set(combos.map((c) => c.inverter_model_id))] } }),
  ]);
  const byId = <T extends { id: number }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]));
  const siteById = byId(sites);
  const moduleById = byId(modules);
  const inverterById = byId(inverters);
  return combos.map((c) => {
    const failures = sizingChecks({
      moduleModel: moduleById.get(c.module_model_id)!,
      inverterModel: inverterById.get(c.inverter_model_id)!,
      site: siteById.get(c.site_id)!,
      modulesInSeries: c.modules_in_series,
      stringsInParallel: c.strings_in_parallel,
    })
      .filter((check) => !check.ok)
      .map((check) => check.code);
    return {
      siteId: c.site_id,
      moduleModelId: c.module_model_id,
      inverterModelId: c.inverter_model_id,
      modulesInSeries: c.modules_in_series,
      stringsInParallel: c.strings_in_parallel,
      count: Number(c.n),
      failures,
    };
  });
}
