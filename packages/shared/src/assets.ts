import { z } from 'zod';
import { moduleSpecSchema } from './module-spec.ts';
import { cellTechnologies } from './asset-records.ts';

const text = (label: string, max: number) =>
  z
    .string({ error: `Enter ${label}` })
    .trim()
    .min(1, `Enter ${label}`)
    .max(max, `Use at most ${max} characters`);

const num = (label: string, unit: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a number in ${unit}` })
    .finite(`${label} must be a number in ${unit}`)
    .min(min, `${label} must be at least ${min} ${unit}`)
    .max(max, `${label} can be at most ${max} ${unit}`);

const int = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a whole number` })
    .int(`${label} must be a whole number`)
    .min(min, `${label} must be at least ${min}`)
    .max(max, `${label} can be at most ${max}`);

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** Tags such as INV07, CB-12B, S2: letters, digits, dot, dash and underscore. */
export const tagSchema = (label: string) =>
  text(label, 40).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, `${label}: letters, digits, dot, dash or underscore, no spaces`);

// ---------- Sites ----------
export const siteInputSchema = z
  .object({
    name: text('a site name', 120),
    code: z
      .string({ error: 'Enter a site code' })
      .trim()
      .toUpperCase()
      .regex(/^[A-Z0-9]{2,8}$/, 'Site code: 2 to 8 letters or digits, like FWM'),
    address: z.string().trim().max(500, 'Use at most 500 characters').default(''),
    timeZone: z
      .string({ error: 'Choose a time zone' })
      .refine(isTimeZone, 'Choose a time zone from the list (like Europe/Berlin)'),
    lowestAmbientC: num('Lowest expected ambient', '°C', -60, 40),
    highestAmbientC: num('Highest expected ambient', '°C', -20, 60),
    designIrradianceWm2: num('Design irradiance', 'W/m²', 200, 1400).default(1000),
    peakSunHours: num('Peak sun hours', 'h/day', 0.5, 12).default(4.5),
    ownerContactEmail: z.email({ error: 'Enter a valid e-mail address for the owner contact' }).max(254),
    ownerUserIds: z.array(z.number().int().positive()).max(50).default([]),
  })
  .refine((s) => s.lowestAmbientC < s.highestAmbientC, {
    path: ['highestAmbientC'],
    message: 'The highest ambient must be above the lowest',
  });
export type SiteInput = z.infer<typeof siteInputSchema>;
export const siteUpdateSchema = z
  .object({
    name: text('a site name', 120).optional(),
    address: z.string().trim().max(500).optional(),
    timeZone: z.string().refine(isTimeZone, 'Choose a time zone from the list (like Europe/Berlin)').optional(),
    lowestAmbientC: num('Lowest expected ambient', '°C', -60, 40).optional(),
    highestAmbientC: num('Highest expected ambient', '°C', -20, 60).optional(),
    designIrradianceWm2: num('Design irradiance', 'W/m²', 200, 1400).optional(),
    peakSunHours: num('Peak sun hours', 'h/day', 0.5, 12).optional(),
    ownerContactEmail: z.email({ error: 'Enter a valid e-mail address' }).max(254).optional(),
    ownerUserIds: z.array(z.number().int().positive()).max(50).optional(),
    isArchived: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type SiteUpdate = z.infer<typeof siteUpdateSchema>;

// ---------- Datasheet libraries ----------

export const moduleModelInputSchema = z
  .object({
    maker: text('the maker', 80),
    model: text('the model', 80),
    cellTechnology: z.enum(cellTechnologies, { error: 'Choose a cell technology' }),
  })
  .and(moduleSpecSchema);
export type ModuleModelInput = z.infer<typeof moduleModelInputSchema>;

export const inverterModelInputSchema = z
  .object({
    maker: text('the maker', 80),
    model: text('the model', 80),
    maxDcV: num('Max DC voltage', 'V', 50, 2000),
    mpptMinV: num('MPPT minimum', 'V', 10, 2000),
    mpptMaxV: num('MPPT maximum', 'V', 10, 2000),
    startV: num('Start voltage', 'V', 10, 2000),
    mpptInputs: int('MPPT inputs', 1, 40),
    maxInputA: num('Max input current', 'A', 1, 500),
    maxInputIscA: num('Max input short-circuit current', 'A', 1, 500),
    ratedAcW: num('Rated AC power', 'W', 100, 10_000_000),
    maxDcW: num('Max DC power', 'W', 100, 15_000_000),
  })
  .superRefine((m, ctx) => {
    if (m.mpptMinV >= m.mpptMaxV)
      ctx.addIssue({ code: 'custom', path: ['mpptMaxV'], message: 'MPPT maximum must be above the MPPT minimum' });
    if (m.mpptMaxV > m.maxDcV)
      ctx.addIssue({ code: 'custom', path: ['mpptMaxV'], message: 'MPPT maximum cannot exceed the max DC voltage' });
    if (m.startV > m.mpptMaxV)
      ctx.addIssue({ code: 'custom', path: ['startV'], message: 'Start voltage must be inside the MPPT window or below it' });
    if (m.maxInputIscA < m.maxInputA)
      ctx.addIssue({ code: 'custom', path: ['maxInputIscA'], message: 'Max short-circuit current is normally at least the max input current' });
  });
export type InverterModelInput = z.infer<typeof inverterModelInputSchema>;

// ---------- Plant equipment ----------
export const inverterInputSchema = z.object({
  siteId: z.number().int().positive(),
  tag: tagSchema('Inverter tag'),
  inverterModelId: z.number({ error: 'Choose an inverter model' }).int().positive(),
  serial: z.string().trim().max(80).default(''),
});
export type InverterInput = z.infer<typeof inverterInputSchema>;

export const combinerBoxInputSchema = z.object({
  siteId: z.number().int().positive(),
  tag: tagSchema('Combiner box tag'),
  fuseRatingA: num('Fuse rating', 'A', 1, 100).nullable().default(null),
});
export type CombinerBoxInput = z.infer<typeof combinerBoxInputSchema>;

export const pvStringInputSchema = z.object({
  label: tagSchema('String label'),
  inverterId: z.number({ error: 'Choose an inverter' }).int().positive(),
  mpptInput: int('MPPT input', 1, 40),
  combinerBoxId: z.number().int().positive().nullable().default(null),
  combinerPosition: int('Combiner position', 1, 64).nullable().default(null),
  moduleModelId: z.number({ error: 'Choose a module model' }).int().positive(),
  modulesInSeries: int('Modules in series', 1, 60),
  stringsInParallel: int('Strings in parallel on the input', 1, 40).default(1),
  commissionedOn: z.iso.date({ error: 'Use a date like 2024-05-31' }).nullable().default(null),
  notes: z.string().max(2000, 'Use at most 2,000 characters').default(''),
});
export type PvStringInput = z.infer<typeof pvStringInputSchema>;
export const pvStringUpdateSchema = pvStringInputSchema
  .partial()
  .extend({ isArchived: z.boolean().optional() })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });

export const listQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  includeArchived: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .default(false),
});

export const stringListQuerySchema = listQuerySchema.extend({
  sort: z.enum(['label', '-label', 'inverter', '-inverter', 'modulesInSeries', '-modulesInSeries']).default('inverter'),
  inverterId: z.coerce.number().int().positive().optional(),
  mpptInput: z.coerce.number().int().positive().optional(),
  moduleModelId: z.coerce.number().int().positive().optional(),
  combinerBoxId: z.coerce.number().int().positive().optional(),
  sizing: z.enum(['all', 'fail', 'ok']).default('all'),
});

// ---------- CSV layout import ----------
/** Columns of a layout CSV; the first row names them (case and spaces do not matter). */
export const layoutCsvColumns = [
  'label',
  'inverter',
  'mppt_input',
  'combiner',
  'position',
  'module_model',
  'modules_in_series',
  'strings_in_parallel',
] as const;
export const requiredLayoutCsvColumns = ['label', 'inverter', 'mppt_input', 'module_model', 'modules_in_series'] as const;

export const importRowSchema = z.object({
  line: z.number(),
  label: z.string(),
  values: z.record(z.string(), z.string()),
  errors: z.array(z.object({ column: z.string(), message: z.string() })),
  warnings: z.array(z.object({ column: z.string(), message: z.string() })),
});
export const importPreviewSchema = z.object({
  committed: z.boolean(),
  fileErrors: z.array(z.string()),
  totalRows: z.number(),
  validRows: z.number(),
  errorRows: z.number(),
  warningRows: z.number(),
  rows: z.array(importRowSchema),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

/** Words shown for each string-sizing check of packages/pv. */
export const sizingCheckLabels: Record<string, string> = {
  COLD_VOC_BELOW_MAX_DC: 'Cold Voc under the inverter maximum',
  HOT_VMP_ABOVE_MPPT_MIN: 'Hot Vmp above the MPPT minimum',
  HOT_VMP_ONE_SUBSTRING_BYPASSED_ABOVE_MPPT_MIN: 'Hot Vmp, one substring bypassed, above the MPPT minimum',
  COLD_VMP_BELOW_MPPT_MAX: 'Cold Vmp under the MPPT maximum',
  HOT_VMP_ABOVE_START: 'Hot Vmp above the start voltage',
  OPERATING_CURRENT_WITHIN_MAX_INPUT: 'Operating current within the input maximum',
  MAX_CIRCUIT_CURRENT_WITHIN_LIMIT: 'Maximum circuit current (1.25 × Isc) within the short-circuit limit',
  POWER_WITHIN_ENVELOPE: 'Array power inside the inverter power envelope',
};
