import { z } from 'zod';

// The asset registry's records as the API sends them: plain shapes, no messages or checks. The forms'
// input schemas (assets.ts) are kept apart, so a page that only shows records (the board's site filter,
// the field page's string) loads and builds these and not every form's.

export const siteSchema = z.object({
  id: z.number(),
  name: z.string(),
  code: z.string(),
  address: z.string(),
  timeZone: z.string(),
  lowestAmbientC: z.number(),
  highestAmbientC: z.number(),
  designIrradianceWm2: z.number(),
  peakSunHours: z.number(),
  ownerContactEmail: z.string(),
  ownerUserIds: z.array(z.number()),
  isArchived: z.boolean(),
  inverterCount: z.number(),
  stringCount: z.number(),
  sizingFailCount: z.number(),
});
export type Site = z.infer<typeof siteSchema>;

export const cellTechnologies = ['mono-PERC', 'TOPCon', 'HJT', 'IBC', 'poly', 'other'] as const;

export const moduleModelSchema = z.object({
  id: z.number(),
  maker: z.string(),
  model: z.string(),
  cellTechnology: z.enum(cellTechnologies),
  pmaxW: z.number(),
  vocV: z.number(),
  iscA: z.number(),
  vmpV: z.number(),
  impA: z.number(),
  alphaIscPctPerC: z.number(),
  betaVocPctPerC: z.number(),
  gammaPmaxPctPerC: z.number(),
  cellsInSeries: z.number(),
  bypassDiodes: z.number(),
  noctC: z.number().nullable(),
  isArchived: z.boolean(),
  stringCount: z.number(),
});
export type ModuleModel = z.infer<typeof moduleModelSchema>;

export const inverterModelSchema = z.object({
  id: z.number(),
  maker: z.string(),
  model: z.string(),
  maxDcV: z.number(),
  mpptMinV: z.number(),
  mpptMaxV: z.number(),
  startV: z.number(),
  mpptInputs: z.number(),
  maxInputA: z.number(),
  maxInputIscA: z.number(),
  ratedAcW: z.number(),
  maxDcW: z.number(),
  isArchived: z.boolean(),
  inverterCount: z.number(),
});
export type InverterModel = z.infer<typeof inverterModelSchema>;

export const inverterSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  tag: z.string(),
  serial: z.string(),
  inverterModelId: z.number(),
  inverterModel: z.string(),
  mpptInputs: z.number(),
  isArchived: z.boolean(),
  stringCount: z.number(),
});
export type Inverter = z.infer<typeof inverterSchema>;

export const combinerBoxSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  tag: z.string(),
  fuseRatingA: z.number().nullable(),
  isArchived: z.boolean(),
  stringCount: z.number(),
});
export type CombinerBox = z.infer<typeof combinerBoxSchema>;

/** One named string-sizing check as the API hands it out. */
export const sizingCheckSchema = z.object({
  code: z.string(),
  label: z.string(),
  ok: z.boolean(),
  value: z.number(),
  limit: z.number(),
  unit: z.string(),
  message: z.string(),
});
export type SizingCheck = z.infer<typeof sizingCheckSchema>;

export const pvStringSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  label: z.string(),
  inverterId: z.number(),
  inverterTag: z.string(),
  mpptInput: z.number(),
  combinerBoxId: z.number().nullable(),
  combinerTag: z.string().nullable(),
  combinerPosition: z.number().nullable(),
  moduleModelId: z.number(),
  moduleModel: z.string(),
  modulesInSeries: z.number(),
  stringsInParallel: z.number(),
  commissionedOn: z.string().nullable(),
  notes: z.string(),
  isArchived: z.boolean(),
  sizingFailures: z.array(z.string()),
});
export type PvString = z.infer<typeof pvStringSchema>;

export const pvStringDetailSchema = pvStringSchema.extend({
  site: siteSchema.pick({
    id: true,
    name: true,
    code: true,
    timeZone: true,
    lowestAmbientC: true,
    highestAmbientC: true,
    designIrradianceWm2: true,
  }),
  module: moduleModelSchema,
  inverter: z.object({ id: z.number(), tag: z.string(), serial: z.string(), model: inverterModelSchema }),
  sizing: z.array(sizingCheckSchema),
});
export type PvStringDetail = z.infer<typeof pvStringDetailSchema>;
