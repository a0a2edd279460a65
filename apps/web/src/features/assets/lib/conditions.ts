import { z } from 'zod';
import { parseDecimal } from './parse-decimal';

/** The operating condition a person picks for the expected values and the what-if curves. */
export type Conditions = { irradianceWm2: number; moduleTempC: number };

/* Narrower than the engine accepts: below 100 W/m² a string's curve says little about a fault,
   and module temperatures outside −40 … 90 °C are not met in the field. */
const conditionsSchema = z.object({
  irradianceWm2: z
    .number({ error: 'Enter the irradiance in W/m²' })
    .min(100, 'Use at least 100 W/m²')
    .max(1400, 'Use at most 1,400 W/m²'),
  moduleTempC: z
    .number({ error: 'Enter the module temperature in °C' })
    .min(-40, 'Use −40 °C or warmer')
    .max(90, 'Use 90 °C or cooler'),
});

export type ConditionsText = { irradianceWm2: string; moduleTempC: string };

/** Reads the two fields as typed; each bad field gets its own message. */
export function parseConditions(text: ConditionsText): { value: Conditions | null; errors: Partial<Record<keyof Conditions, string>> } {
  const parsed = conditionsSchema.safeParse({
    irradianceWm2: parseDecimal(text.irradianceWm2),
    moduleTempC: parseDecimal(text.moduleTempC),
  });
  if (parsed.success) return { value: parsed.data, errors: {} };
  const errors: Partial<Record<keyof Conditions, string>> = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path[0];
    if ((key === 'irradianceWm2' || key === 'moduleTempC') && !errors[key]) errors[key] = issue.message;
  }
  return { value: null, errors };
}
