import type { CreationAttributes, Transaction } from 'sequelize';
import { CombinerBox, Inverter, InverterModel, ModuleModel, PvString, Site, SiteOwner, User } from '../src/models/index.ts';

// The invented plant of the demo (see shared demo scenario): makers are named after the product itself.
const maker = { modules: 'Stringfield Demo Modules', inverters: 'Stringfield Demo Inverters' };

export const demoModuleModels = [
  { model: 'SDM-330-60P', cellTechnology: 'poly', pmaxW: 330, vocV: 40.6, iscA: 10.3, vmpV: 33.8, impA: 9.77, alphaIscPctPerC: 0.05, betaVocPctPerC: -0.3, gammaPmaxPctPerC: -0.38, cellsInSeries: 60, bypassDiodes: 3, noctC: 45 },
  { model: 'SDM-405-72M', cellTechnology: 'mono-PERC', pmaxW: 405, vocV: 49.8, iscA: 10.35, vmpV: 41.7, impA: 9.71, alphaIscPctPerC: 0.048, betaVocPctPerC: -0.27, gammaPmaxPctPerC: -0.35, cellsInSeries: 72, bypassDiodes: 3, noctC: 44 },
  { model: 'SDM-550-144H', cellTechnology: 'mono-PERC', pmaxW: 550, vocV: 49.9, iscA: 14.0, vmpV: 41.9, impA: 13.13, alphaIscPctPerC: 0.045, betaVocPctPerC: -0.26, gammaPmaxPctPerC: -0.34, cellsInSeries: 72, bypassDiodes: 3, noctC: 43 },
] as const;

// SDI-125K-6 takes 250 kW DC (not the 190 kW of the first draft of the scenario) so that 4 strings of
// 25 × 405 W per input sit inside its power envelope; Fenwick Moor uses the larger SDI-350K-6 because
// 4 strings of 550 W modules per input carry 52.5 A, more than the SDI-125K-6's 40 A inputs.
export const demoInverterModels = [
  { model: 'SDI-125K-6', maxDcV: 1500, startV: 600, mpptMinV: 600, mpptMaxV: 1300, mpptInputs: 6, maxInputA: 40, maxInputIscA: 60, ratedAcW: 125_000, maxDcW: 250_000 },
  { model: 'SDI-350K-6', maxDcV: 1500, startV: 600, mpptMinV: 600, mpptMaxV: 1300, mpptInputs: 6, maxInputA: 60, maxInputIscA: 90, ratedAcW: 350_000, maxDcW: 400_000 },
  { model: 'SDI-25K-2', maxDcV: 1000, startV: 180, mpptMinV: 200, mpptMaxV: 850, mpptInputs: 2, maxInputA: 26, maxInputIscA: 40, ratedAcW: 25_000, maxDcW: 37_500 },
] as const;

type SiteSpec = {
  site: Omit<CreationAttributes<Site>, 'id'>;
  owners: string[];
  inverterModel: string;
  inverters: number;
  inputs: number;
  stringsPerInput: number;
  moduleModel: string;
  modulesInSeries: (inverter: number) => number;
  combiners: boolean;
  commissionedOn: string;
};

export const demoSites: SiteSpec[] = [
  {
    site: { name: 'Fenwick Moor Solar', code: 'FWM', address: 'Fenwick Moor, ground-mounted plant (invented)', timeZone: 'Europe/Berlin', lowestAmbientC: -15, highestAmbientC: 36, designIrradianceWm2: 1000, ownerContactEmail: 'owner@stringfield.test' },
    owners: ['owner@stringfield.test'],
    inverterModel: 'SDI-350K-6',
    inverters: 25,
    inputs: 6,
    stringsPerInput: 4,
    moduleModel: 'SDM-550-144H',
    modulesInSeries: () => 26,
    combiners: true,
    commissionedOn: '2023-06-14',
  },
  {
    site: { name: 'Ostrander Ridge Solar', code: 'OSR', address: 'Ostrander Ridge, cold-climate ground mount (invented)', timeZone: 'America/Edmonton', lowestAmbientC: -31, highestAmbientC: 33, designIrradianceWm2: 1000, ownerContactEmail: 'owner@stringfield.test' },
    owners: ['owner@stringfield.test'],
    inverterModel: 'SDI-125K-6',
    inverters: 8,
    inputs: 6,
    stringsPerInput: 4,
    moduleModel: 'SDM-405-72M',
    // Inverter 8's strings are 28 modules long: too long for 1500 V at the site's record cold (deliberate).
    modulesInSeries: (inverter) => (inverter === 8 ? 28 : 25),
    combiners: false,
    commissionedOn: '2021-09-02',
  },
  {
    site: { name: 'Calder Bay Distribution Centre', code: 'CBD', address: 'Calder Bay logistics park, rooftop (invented)', timeZone: 'Europe/Vienna', lowestAmbientC: -8, highestAmbientC: 38, designIrradianceWm2: 1000, ownerContactEmail: 'calder.owner@stringfield.test' },
    owners: ['calder.owner@stringfield.test'],
    inverterModel: 'SDI-25K-2',
    inverters: 10,
    inputs: 2,
    stringsPerInput: 2,
    moduleModel: 'SDM-330-60P',
    modulesInSeries: () => 18,
    combiners: false,
    commissionedOn: '2019-04-23',
  },
];

const pad = (n: number) => String(n).padStart(2, '0');

/** Seed the demo libraries and the three demo sites; a site whose code already exists is left alone. */
export async function seedDemoPlant(transaction: Transaction): Promise<{ sites: number; strings: number }> {
  const modules = new Map<string, ModuleModel>();
  for (const m of demoModuleModels) {
    const [row] = await ModuleModel.findOrCreate({ where: { maker: maker.modules, model: m.model }, defaults: { ...m, maker: maker.modules }, transaction });
    modules.set(m.model, row);
  }
  const inverterModels = new Map<string, InverterModel>();
  for (const m of demoInverterModels) {
    const [row] = await InverterModel.findOrCreate({ where: { maker: maker.inverters, model: m.model }, defaults: { ...m, maker: maker.inverters }, transaction });
    inverterModels.set(m.model, row);
  }
  let sites = 0;
  let strings = 0;
  for (const spec of demoSites) {
    if (await Site.findOne({ where: { code: spec.site.code }, transaction })) continue;
    const site = await Site.create(spec.site, { transaction });
    sites += 1;
    const owners = await User.findAll({ where: { email: spec.owners }, transaction });
    await SiteOwner.bulkCreate(owners.map((u) => ({ siteId: site.id, userId: u.id })), { transaction });
    const model = inverterModels.get(spec.inverterModel)!;
    const inverters = await Inverter.bulkCreate(
      Array.from({ length: spec.inverters }, (_, i) => ({
        siteId: site.id,
        tag: `INV${pad(i + 1)}`,
        inverterModelId: model.id,
        serial: `${spec.site.code}-${model.model.replace(/[^A-Z0-9]/g, '')}-${String(24017 + i * 13).padStart(6, '0')}`,
      })),
      { transaction },
    );
    const rows: Array<CreationAttributes<PvString>> = [];
    for (const [index, inverter] of inverters.entries()) {
      const number = index + 1;
      let boxes: CombinerBox[] = [];
      if (spec.combiners) {
        boxes = await CombinerBox.bulkCreate(
          ['A', 'B'].map((half) => ({ siteId: site.id, tag: `CB-${pad(number)}${half}`, fuseRatingA: 25 })),
          { transaction },
        );
      }
      for (let input = 1; input <= spec.inputs; input += 1) {
        for (let s = 1; s <= spec.stringsPerInput; s += 1) {
          const box = boxes.length ? boxes[input <= spec.inputs / 2 ? 0 : 1]! : null;
          const position = box ? ((input - 1) % (spec.inputs / 2)) * spec.stringsPerInput + s : null;
          rows.push({
            siteId: site.id,
            inverterId: inverter.id,
            mpptInput: input,
            combinerBoxId: box?.id ?? null,
            combinerPosition: position,
            label: `INV${pad(number)}-MPPT${input}-S${s}`,
            moduleModelId: modules.get(spec.moduleModel)!.id,
            modulesInSeries: spec.modulesInSeries(number),
            stringsInParallel: spec.stringsPerInput,
            commissionedOn: spec.commissionedOn,
            notes: '',
          });
        }
      }
    }
    await PvString.bulkCreate(rows, { transaction });
    strings += rows.length;
  }
  return { sites, strings };
}
