import type { StringCheck, StringCheckInput } from '@stringfield/shared';

/** What the check form holds: the shared input type, before zod fills defaults. */
export type CheckFormValues = {
  clientId: string;
  stringId: number;
  phase: StringCheckInput['phase'] | undefined;
  takenAt: string;
  vocV: number | undefined;
  iscA?: number | undefined;
  operatingCurrentA?: number | undefined;
  operatingVoltageV?: number | undefined;
  irradianceWm2?: number | undefined;
  irradianceMethod?: StringCheckInput['irradianceMethod'] | undefined;
  moduleTempC?: number | undefined;
  moduleTempMethod?: StringCheckInput['moduleTempMethod'] | undefined;
  ambientC?: number | undefined;
  polarityCorrect: boolean | undefined;
  insulationPlusMOhm?: number | undefined;
  insulationMinusMOhm?: number | undefined;
  insulationTestVoltageV?: number | undefined;
  instrumentIds: number[];
  notes: string;
};

/** The conditions a technician copies from one check to the next (the sun and the modules barely change in minutes). */
export type Conditions = Pick<StringCheckInput, 'irradianceWm2' | 'irradianceMethod' | 'moduleTempC' | 'moduleTempMethod' | 'ambientC'>;

/**
 * A typed decimal as a number: blank is "not measured" (undefined); a decimal comma, a leading plus
 * and a typographic minus are accepted; anything else is NaN, which the schema reports as
 * "must be a number in V".
 */
export function parseDecimal(raw: unknown): number | undefined {
  if (typeof raw === 'number') return raw;
  if (typeof raw !== 'string') return undefined;
  const text = raw.trim().replace(/\s+/g, '').replace(/^[−–]/, '-').replace(/^\+/, '');
  if (text === '') return undefined;
  const normal = text.replace(',', '.');
  return /^-?(\d+\.?\d*|\.\d+)$/.test(normal) ? Number(normal) : Number.NaN;
}

/** Same as parseDecimal, for selects whose empty option means "not chosen". */
export function parseOptionalInt(raw: unknown): number | undefined {
  if (raw === '' || raw === undefined || raw === null) return undefined;
  const n = Number(raw);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** An empty select or text as undefined, so an optional enum is left out rather than sent as "". */
export function emptyToUndefined<T extends string>(raw: unknown): T | undefined {
  return typeof raw === 'string' && raw !== '' ? (raw as T) : undefined;
}

/** A fresh form for one string. */
export function emptyCheckValues(init: { clientId: string; stringId: number; takenAt: string; phase?: StringCheckInput['phase'] }): CheckFormValues {
  return {
    clientId: init.clientId,
    stringId: init.stringId,
    phase: init.phase,
    takenAt: init.takenAt,
    vocV: undefined,
    polarityCorrect: undefined,
    instrumentIds: [],
    notes: '',
  };
}

const orUndefined = <T>(value: T | null): T | undefined => (value === null ? undefined : value);

/** A saved check as form values, for "Correct this reading": same string and time, a new client id. */
export function checkToFormValues(check: StringCheck, clientId: string): CheckFormValues {
  return {
    clientId,
    stringId: check.stringId,
    phase: check.phase,
    takenAt: check.takenAt,
    vocV: check.vocV,
    iscA: orUndefined(check.iscA),
    operatingCurrentA: orUndefined(check.operatingCurrentA),
    operatingVoltageV: orUndefined(check.operatingVoltageV),
    irradianceWm2: orUndefined(check.irradianceWm2),
    irradianceMethod: orUndefined(check.irradianceMethod),
    moduleTempC: orUndefined(check.moduleTempC),
    moduleTempMethod: orUndefined(check.moduleTempMethod),
    ambientC: orUndefined(check.ambientC),
    polarityCorrect: check.polarityCorrect,
    insulationPlusMOhm: orUndefined(check.insulationPlusMOhm),
    insulationMinusMOhm: orUndefined(check.insulationMinusMOhm),
    insulationTestVoltageV: orUndefined(check.insulationTestVoltageV),
    instrumentIds: [...check.instrumentIds],
    notes: check.notes,
  };
}

/** The conditions of a saved check or a queued input, with "not measured" left out. */
export function conditionsOf(source: StringCheck | StringCheckInput): Conditions {
  const pick = <T>(value: T | null | undefined): T | undefined => (value === null ? undefined : value);
  return {
    irradianceWm2: pick(source.irradianceWm2),
    irradianceMethod: pick(source.irradianceMethod),
    moduleTempC: pick(source.moduleTempC),
    moduleTempMethod: pick(source.moduleTempMethod),
    ambientC: pick(source.ambientC),
  };
}

function hasConditions(c: Conditions): boolean {
  return c.irradianceWm2 !== undefined || c.moduleTempC !== undefined || c.ambientC !== undefined;
}

/**
 * The conditions of this technician's most recent reading, saved or still queued on the phone,
 * that recorded any; null when there is none to copy.
 */
export function previousConditions(
  saved: readonly StringCheck[],
  queued: readonly StringCheckInput[],
  technicianId: number,
): { conditions: Conditions; takenAt: string } | null {
  const candidates = [
    ...saved.filter((c) => c.technician.id === technicianId && c.supersededById === null).map((c) => ({ takenAt: c.takenAt, conditions: conditionsOf(c) })),
    ...queued.map((q) => ({ takenAt: q.takenAt, conditions: conditionsOf(q) })),
  ].filter((c) => hasConditions(c.conditions));
  candidates.sort((a, b) => Date.parse(b.takenAt) - Date.parse(a.takenAt));
  return candidates[0] ?? null;
}

/**
 * The validated form as the request body. A new reading is stamped with the time it was saved
 * (a correction keeps the time of the reading it corrects); instruments are listed once.
 */
export function toCheckPayload(values: StringCheckInput, options: { isCorrection: boolean; now: Date }): StringCheckInput {
  const payload: StringCheckInput = {
    ...values,
    takenAt: options.isCorrection ? values.takenAt : options.now.toISOString(),
    instrumentIds: [...new Set(values.instrumentIds)],
    notes: values.notes.trim(),
  };
  for (const key of Object.keys(payload) as Array<keyof StringCheckInput>) {
    if (payload[key] === undefined) delete payload[key];
  }
  return payload;
}
