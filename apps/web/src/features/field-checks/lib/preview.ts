import { diagnoseStringCheck, insulationResistanceRequirement, type CurvePoints } from '@stringfield/pv';
import type { Instrument } from '@stringfield/shared';
import type { CheckFormValues } from './check-values';
import type { StringSpec } from './string-spec';

export type Verdict = 'pass' | 'attention' | 'fail';

export type PreviewFinding = { code: string; severity: 'fail' | 'attention'; message: string };

export type CheckPreview = {
  verdict: Verdict;
  /** Expected string values at the typed irradiance and module temperature; null without irradiance. */
  expected: CurvePoints | null;
  vocDeviationPct: number | null;
  iscDeviationPct: number | null;
  findings: PreviewFinding[];
  /** The expected values assume 25 °C because no module temperature was typed. */
  isTemperatureAssumed: boolean;
};

const finite = (v: number | undefined, min: number, max: number): number | undefined =>
  v !== undefined && Number.isFinite(v) && v >= min && v <= max ? v : undefined;

/**
 * What the server will most likely say, computed in the browser while the technician types: the
 * engine's verdict plus the checks the server adds (polarity recorded wrong, insulation below the
 * IEC 62446 minimum or tested at too low a voltage, an instrument past calibration). Peers are not
 * known here, so the saved verdict can differ; it is the one that counts. Null until Voc is a number.
 */
export function previewCheck(spec: StringSpec, values: Partial<CheckFormValues>, instruments: readonly Instrument[] = [], day?: string): CheckPreview | null {
  const vocV = finite(values.vocV, -1500, 1500);
  if (vocV === undefined) return null;
  const iscA = finite(values.iscA, 0, 50);
  const irradianceWm2 = finite(values.irradianceWm2, 0, 1500);
  const moduleTempC = finite(values.moduleTempC, -40, 100);
  let result: ReturnType<typeof diagnoseStringCheck>;
  try {
    result = diagnoseStringCheck({
      module: spec.module,
      modulesInSeries: spec.modulesInSeries,
      measured: {
        vocV,
        ...(iscA !== undefined ? { iscA } : {}),
        ...(irradianceWm2 !== undefined ? { irradianceWm2 } : {}),
        ...(moduleTempC !== undefined ? { moduleTempC } : {}),
      },
    });
  } catch {
    // A datasheet the engine refuses: no preview rather than a broken form.
    return null;
  }
  const findings: PreviewFinding[] = result.findings.map((f) => ({ code: f.code, severity: f.severity, message: f.message }));

  if (values.polarityCorrect === false && !findings.some((f) => f.code === 'REVERSE_POLARITY')) {
    findings.push({
      code: 'REVERSE_POLARITY',
      severity: 'fail',
      message: 'Polarity was recorded as wrong: stop, do not connect the string or close its fuse or switch until the wiring is corrected.',
    });
  }

  const insulation = [finite(values.insulationPlusMOhm, 0, 100_000), finite(values.insulationMinusMOhm, 0, 100_000)].filter((v): v is number => v !== undefined);
  if (insulation.length > 0) {
    const systemV = 1.25 * spec.module.vocV * spec.modulesInSeries;
    const req = insulationResistanceRequirement(systemV);
    const lowest = Math.min(...insulation);
    if (lowest < req.minResistanceMOhm) {
      findings.push({
        code: 'INSULATION_LOW',
        severity: 'fail',
        message: `Insulation resistance ${lowest} MΩ is below the ${req.minResistanceMOhm} MΩ minimum for a ${Math.round(systemV)} V system: suspect a ground fault; keep the string isolated.`,
      });
    }
    if (values.insulationTestVoltageV !== undefined && values.insulationTestVoltageV < req.testVoltageV) {
      findings.push({
        code: 'INSULATION_TEST_VOLTAGE_LOW',
        severity: 'attention',
        message: `The insulation test ran at ${values.insulationTestVoltageV} V; a ${Math.round(systemV)} V system is tested at ${req.testVoltageV} V. Repeat at the right voltage.`,
      });
    }
  }

  if (day) {
    const selected = new Set(values.instrumentIds ?? []);
    for (const i of instruments) {
      if (selected.has(i.id) && i.calibrationDueOn < day) {
        findings.push({
          code: 'INSTRUMENT_CALIBRATION_OVERDUE',
          severity: 'attention',
          message: `Instrument ${i.serial} was due for calibration on ${i.calibrationDueOn}; the reading is kept but flagged.`,
        });
      }
    }
  }

  const verdict: Verdict = findings.some((f) => f.severity === 'fail') ? 'fail' : findings.length > 0 || result.verdict === 'attention' ? 'attention' : result.verdict;
  return {
    verdict,
    expected: result.expected,
    vocDeviationPct: result.vocDeviationPct,
    iscDeviationPct: result.iscDeviationPct,
    findings,
    isTemperatureAssumed: irradianceWm2 !== undefined && moduleTempC === undefined,
  };
}
