import { z } from 'zod';

export const photoTags = ['before', 'after', 'thermal', 'nameplate', 'other'] as const;
export const photoTagLabels: Record<(typeof photoTags)[number], string> = {
  before: 'Before repair',
  after: 'After repair',
  thermal: 'Thermal image',
  nameplate: 'Nameplate',
  other: 'Other',
};

/** Form fields sent with each uploaded image (multipart: `files` plus a JSON `meta` array, one entry per file). */
export const photoMetaSchema = z.object({
  tag: z.enum(photoTags, { error: 'Tag each photo: before, after, thermal, nameplate or other' }),
  stringId: z.number().int().positive().nullable().default(null),
  modulePosition: z
    .number({ error: 'Module position must be a whole number' })
    .int('Module position must be a whole number')
    .min(1, 'Module positions count from 1 at the + end')
    .max(100, 'Module position can be at most 100')
    .nullable()
    .default(null),
  caption: z.string().trim().max(300, 'Use at most 300 characters').default(''),
});
export type PhotoMeta = z.infer<typeof photoMetaSchema>;

export const photoSchema = z.object({
  id: z.number(),
  workOrderId: z.number(),
  stringId: z.number().nullable(),
  stringLabel: z.string().nullable(),
  modulePosition: z.number().nullable(),
  tag: z.enum(photoTags),
  caption: z.string(),
  width: z.number(),
  height: z.number(),
  bytes: z.number(),
  sha256: z.string(),
  capturedAt: z.string().nullable(),
  gps: z.object({ lat: z.number(), lon: z.number() }).nullable(),
  uploadedBy: z.object({ id: z.number(), name: z.string() }),
  createdAt: z.string(),
  urls: z.object({ thumb: z.string(), screen: z.string(), original: z.string() }),
  thermal: z
    .object({
      hottestC: z.number(),
      referenceC: z.number(),
      deltaTC: z.number(),
      irradianceWm2: z.number(),
      pattern: z.string(),
      modulePosition: z.number().nullable(),
      classOfAbnormality: z.number().nullable(),
      isConditionsTooPoor: z.boolean(),
      reason: z.string(),
    })
    .nullable(),
});
export type Photo = z.infer<typeof photoSchema>;

export const thermalPatterns = ['single_cell', 'substring', 'whole_module', 'junction_box', 'connector', 'diode'] as const;
export const thermalPatternLabels: Record<(typeof thermalPatterns)[number], string> = {
  single_cell: 'Single cell',
  substring: 'Substring',
  whole_module: 'Whole module',
  junction_box: 'Junction box',
  connector: 'Connector',
  diode: 'Diode',
};

export const thermalFindingInputSchema = z
  .object({
    hottestC: z.number({ error: 'Hottest spot must be a number in °C' }).min(-40, 'At least −40 °C').max(250, 'At most 250 °C'),
    referenceC: z.number({ error: 'Reference must be a number in °C' }).min(-40, 'At least −40 °C').max(150, 'At most 150 °C'),
    irradianceWm2: z.number({ error: 'Irradiance must be a number in W/m²' }).min(0, 'At least 0 W/m²').max(1500, 'At most 1500 W/m²'),
    pattern: z.enum(thermalPatterns, { error: 'Choose the pattern' }),
    modulePosition: z.number().int().min(1).max(100).nullable().default(null),
  })
  .refine((t) => t.hottestC >= t.referenceC, { path: ['hottestC'], message: 'The hottest spot cannot be cooler than the reference' });
export type ThermalFindingInput = z.infer<typeof thermalFindingInputSchema>;

export const diodeFailureModes = ['short', 'open', 'burnt', 'cracked_solder', 'other'] as const;
export const diodeFoundBy = ['voc_deficit', 'thermal_image', 'diode_test'] as const;
export const diodeTypes = ['schottky', 'pn'] as const;

const part = z.object({
  partNumber: z.string({ error: 'Enter the part number' }).trim().min(1, 'Enter the part number').max(80),
  ratingA: z.number({ error: 'Rating in A' }).gt(0, 'More than 0 A').max(100, 'At most 100 A'),
  ratingV: z.number({ error: 'Rating in V' }).gt(0, 'More than 0 V').max(1000, 'At most 1000 V'),
  type: z.enum(diodeTypes, { error: 'Schottky or p-n' }),
});

/** A bypass-diode replacement; photos are links to uploads of the same ticket. */
export const diodeReplacementInputSchema = z.object({
  stringId: z.number({ error: 'Choose the string' }).int().positive(),
  modulePosition: z.number({ error: 'Module position must be a whole number' }).int().min(1, 'Count from 1 at the + end').max(100),
  moduleSerial: z.string().trim().max(80).default(''),
  diodePosition: z.number({ error: 'Diode position must be a whole number' }).int().min(1, 'Diode positions count from 1').max(12),
  failureMode: z.enum(diodeFailureModes, { error: 'Choose what was found' }),
  foundBy: z.enum(diodeFoundBy, { error: 'Choose how it was found' }),
  removedPart: part.partial().default({}),
  installedPart: part,
  newDiodeForwardV: z.number({ error: 'Forward voltage in V' }).min(0.05, 'At least 0.05 V').max(2, 'At most 2 V').nullable().default(null),
  vocBeforeV: z.number().min(0).max(1500).nullable().default(null),
  vocAfterV: z.number().min(0).max(1500).nullable().default(null),
  beforePhotoId: z.number().int().positive().nullable().default(null),
  afterPhotoId: z.number().int().positive().nullable().default(null),
  notes: z.string().trim().max(2000).default(''),
});
export type DiodeReplacementInput = z.infer<typeof diodeReplacementInputSchema>;

export const diodeReplacementSchema = z.object({
  id: z.number(),
  workOrderId: z.number(),
  workOrderNumber: z.string(),
  stringId: z.number(),
  stringLabel: z.string(),
  modulePosition: z.number(),
  moduleSerial: z.string(),
  diodePosition: z.number(),
  failureMode: z.enum(diodeFailureModes),
  foundBy: z.enum(diodeFoundBy),
  removedPart: z.record(z.string(), z.unknown()),
  installedPart: z.record(z.string(), z.unknown()),
  newDiodeForwardV: z.number().nullable(),
  vocBeforeV: z.number().nullable(),
  vocAfterV: z.number().nullable(),
  beforePhotoId: z.number().nullable(),
  afterPhotoId: z.number().nullable(),
  notes: z.string(),
  technician: z.object({ id: z.number(), name: z.string() }),
  createdAt: z.string(),
  /** What is still missing before a supervisor can accept the record. */
  missing: z.array(z.string()),
});
export type DiodeReplacement = z.infer<typeof diodeReplacementSchema>;
