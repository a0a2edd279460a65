import { z } from 'zod';

export const instrumentKinds = ['multimeter', 'clamp_meter', 'insulation_tester', 'irradiance_meter', 'iv_tracer', 'thermal_camera'] as const;
export const instrumentKindLabels: Record<(typeof instrumentKinds)[number], string> = {
  multimeter: 'Multimeter',
  clamp_meter: 'Clamp meter',
  insulation_tester: 'Insulation tester',
  irradiance_meter: 'Irradiance meter',
  iv_tracer: 'I-V tracer',
  thermal_camera: 'Thermal camera',
};

export const instrumentInputSchema = z.object({
  kind: z.enum(instrumentKinds, { error: 'Choose the kind of instrument' }),
  serial: z.string({ error: 'Enter the serial number' }).trim().min(1, 'Enter the serial number').max(80, 'Use at most 80 characters'),
  model: z.string().trim().max(120, 'Use at most 120 characters').default(''),
  calibrationDueOn: z.iso.date({ error: 'Enter the calibration due date, like 2027-03-31' }),
});
export type InstrumentInput = z.infer<typeof instrumentInputSchema>;

export const instrumentSchema = z.object({
  id: z.number(),
  kind: z.enum(instrumentKinds),
  serial: z.string(),
  model: z.string(),
  calibrationDueOn: z.string(),
  isCalibrationOverdue: z.boolean(),
  isArchived: z.boolean(),
});
export type Instrument = z.infer<typeof instrumentSchema>;

export const irradianceMethods = ['reference_cell', 'pyranometer', 'estimated'] as const;
export const irradianceMethodLabels: Record<(typeof irradianceMethods)[number], string> = {
  reference_cell: 'Reference cell',
  pyranometer: 'Pyranometer',
  estimated: 'Estimated',
};
export const moduleTempMethods = ['back_sensor', 'estimated_from_ambient'] as const;
export const moduleTempMethodLabels: Record<(typeof moduleTempMethods)[number], string> = {
  back_sensor: 'Sensor on the module back',
  estimated_from_ambient: 'Estimated from ambient',
};
export const checkPhases = ['before', 'after'] as const;
export const insulationTestVoltages = [250, 500, 1000, 1500] as const;

const measured = (label: string, unit: string, min: number, max: number) =>
  z
    // Nothing typed asks for the reading; something typed that is not a number says so.
    .number({ error: (issue) => (issue.input === undefined ? `Enter the ${label} in ${unit}` : `${label} must be a number in ${unit}`) })
    .finite(`${label} must be a number in ${unit}`)
    .min(min, `${label} must be at least ${min} ${unit}`)
    .max(max, `${label} can be at most ${max} ${unit}`);

/** One string measurement as the technician enters it (the server computes the verdict). */
export const stringCheckInputSchema = z
  .object({
    /** Made on the device, so that a retried or queued request never creates a second check. */
    clientId: z.uuid({ error: 'clientId must be a UUID made on the device' }),
    stringId: z.number({ error: 'Choose the string' }).int().positive(),
    phase: z.enum(checkPhases, { error: 'Choose before or after repair' }),
    takenAt: z.iso.datetime({ offset: true, error: 'Use an ISO date and time' }),
    // Negative Voc is allowed: it is how reversed polarity shows.
    vocV: measured('Voc', 'V', -1500, 1500),
    iscA: measured('Isc', 'A', 0, 50).optional(),
    operatingCurrentA: measured('Operating current', 'A', 0, 50).optional(),
    operatingVoltageV: measured('Operating voltage', 'V', 0, 1500).optional(),
    irradianceWm2: measured('Irradiance', 'W/m²', 0, 1500).optional(),
    irradianceMethod: z.enum(irradianceMethods).optional(),
    moduleTempC: measured('Module temperature', '°C', -40, 100).optional(),
    moduleTempMethod: z.enum(moduleTempMethods).optional(),
    ambientC: measured('Ambient temperature', '°C', -40, 60).optional(),
    polarityCorrect: z.boolean({ error: 'Say whether the polarity is correct' }),
    insulationPlusMOhm: measured('Insulation + to earth', 'MΩ', 0, 100_000).optional(),
    insulationMinusMOhm: measured('Insulation − to earth', 'MΩ', 0, 100_000).optional(),
    insulationTestVoltageV: z
      .number({ error: 'Choose the insulation test voltage' })
      .refine((v) => (insulationTestVoltages as readonly number[]).includes(v), 'Choose 250, 500, 1000 or 1500 V')
      .optional(),
    instrumentIds: z.array(z.number().int().positive()).max(10).default([]),
    notes: z.string().trim().max(2000, 'Use at most 2,000 characters').default(''),
  })
  .superRefine((c, ctx) => {
    if (c.irradianceWm2 !== undefined && !c.irradianceMethod)
      ctx.addIssue({ code: 'custom', path: ['irradianceMethod'], message: 'Say how the irradiance was measured' });
    if (c.moduleTempC !== undefined && !c.moduleTempMethod)
      ctx.addIssue({ code: 'custom', path: ['moduleTempMethod'], message: 'Say how the module temperature was taken' });
    const hasInsulation = c.insulationPlusMOhm !== undefined || c.insulationMinusMOhm !== undefined;
    if (hasInsulation && c.insulationTestVoltageV === undefined)
      ctx.addIssue({ code: 'custom', path: ['insulationTestVoltageV'], message: 'Give the test voltage of the insulation reading' });
    if (Date.parse(c.takenAt) > Date.now() + 10 * 60_000)
      ctx.addIssue({ code: 'custom', path: ['takenAt'], message: 'The time of the reading is in the future' });
  });
export type StringCheckInput = z.infer<typeof stringCheckInputSchema>;

export const findingSchema = z.object({
  code: z.string(),
  severity: z.enum(['fail', 'attention']),
  confidence: z.number(),
  message: z.string(),
  detail: z.record(z.string(), z.union([z.number(), z.string(), z.boolean()])),
});
export type CheckFinding = z.infer<typeof findingSchema>;

export const stringCheckSchema = z.object({
  id: z.number(),
  clientId: z.string(),
  workOrderId: z.number(),
  workOrderNumber: z.string(),
  stringId: z.number(),
  stringLabel: z.string(),
  phase: z.enum(checkPhases),
  takenAt: z.string(),
  technician: z.object({ id: z.number(), name: z.string() }),
  vocV: z.number(),
  iscA: z.number().nullable(),
  operatingCurrentA: z.number().nullable(),
  operatingVoltageV: z.number().nullable(),
  irradianceWm2: z.number().nullable(),
  irradianceMethod: z.enum(irradianceMethods).nullable(),
  moduleTempC: z.number().nullable(),
  moduleTempMethod: z.enum(moduleTempMethods).nullable(),
  ambientC: z.number().nullable(),
  polarityCorrect: z.boolean(),
  insulationPlusMOhm: z.number().nullable(),
  insulationMinusMOhm: z.number().nullable(),
  insulationTestVoltageV: z.number().nullable(),
  instrumentIds: z.array(z.number()),
  notes: z.string(),
  expected: z.object({ vocV: z.number(), iscA: z.number(), vmpV: z.number(), impA: z.number(), pmpW: z.number() }).nullable(),
  vocDeviationPct: z.number().nullable(),
  iscDeviationPct: z.number().nullable(),
  verdict: z.enum(['pass', 'attention', 'fail']),
  findings: z.array(findingSchema),
  peers: z.array(z.object({ stringLabel: z.string(), vocV: z.number(), iscA: z.number().nullable(), takenAt: z.string() })),
  isCalibrationOverdue: z.boolean(),
  engineVersion: z.string(),
  supersedesId: z.number().nullable(),
  supersededById: z.number().nullable(),
  hasIvTrace: z.boolean(),
  createdAt: z.string(),
});
export type StringCheck = z.infer<typeof stringCheckSchema>;

export const ivTraceSchema = z.object({
  checkId: z.number(),
  fileName: z.string(),
  irradianceWm2: z.number(),
  cellTempC: z.number(),
  points: z.array(z.object({ voltageV: z.number(), currentA: z.number() })),
  stcPoints: z.array(z.object({ voltageV: z.number(), currentA: z.number() })),
  analysis: z.object({
    iscA: z.number(),
    vocV: z.number(),
    pmpW: z.number(),
    vmpV: z.number(),
    impA: z.number(),
    fillFactor: z.number(),
    seriesOhmEstimate: z.number().nullable(),
    shuntOhmEstimate: z.number().nullable(),
    steps: z.array(z.object({ atV: z.number(), atA: z.number() })),
    likelyBypassedSubstrings: z.number(),
  }),
  stcAnalysis: z.object({ iscA: z.number(), vocV: z.number(), pmpW: z.number(), fillFactor: z.number() }),
  translation: z.object({ procedure: z.number(), seriesOhm: z.number(), kappaOhmPerC: z.number(), isApproximate: z.boolean() }),
});
export type IvTrace = z.infer<typeof ivTraceSchema>;
