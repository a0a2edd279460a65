import { z } from 'zod';
import { checkPhases, instrumentKinds, insulationTestVoltages, irradianceMethods, moduleTempMethods } from './field-checks.ts';

// What a technician enters: a string check and an instrument, checked by the API and by the forms, with
// a message for every field. Apart from field-checks.ts (the records and their labels), so the field
// page builds these only once a form opens.

export const instrumentInputSchema = z.object({
  kind: z.enum(instrumentKinds, { error: 'Choose the kind of instrument' }),
  serial: z.string({ error: 'Enter the serial number' }).trim().min(1, 'Enter the serial number').max(80, 'Use at most 80 characters'),
  model: z.string().trim().max(120, 'Use at most 120 characters').default(''),
  calibrationDueOn: z.iso.date({ error: 'Enter the calibration due date, like 2027-03-31' }),
});
export type InstrumentInput = z.infer<typeof instrumentInputSchema>;

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
