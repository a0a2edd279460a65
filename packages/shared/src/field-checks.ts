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
