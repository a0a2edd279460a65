import { assertNumber } from './assert-number.ts';
import { DEFAULT_TOLERANCES, type ThermalThresholds } from './default-tolerances.ts';

/** Thermal patterns of IEC TS 62446-3's informative table (names as used in the field). */
export const THERMAL_PATTERNS = [
  'hot-cell',
  'several-hot-cells',
  'patchwork',
  'warm-substring',
  'warm-module',
  'warm-junction-box',
  'hot-connector',
  'other',
] as const;
/** One of {@link THERMAL_PATTERNS}. */
export type ThermalPattern = (typeof THERMAL_PATTERNS)[number];

/** Input of {@link classifyThermalAnomaly}. */
export type ThermalAnomalyInput = {
  /** Temperature difference to a healthy reference area of the same or a neighbouring module, K (≥ 0). */
  readonly deltaTC: number;
  /** Plane-of-array irradiance when the image was taken, W/m² (≥ 0). */
  readonly irradianceWm2: number;
  readonly pattern?: ThermalPattern;
  /** Highest absolute temperature of the anomaly, °C, if known. */
  readonly maxTempC?: number;
  /** Overrides of DEFAULT_TOLERANCES.thermal. */
  readonly thresholds?: Partial<ThermalThresholds>;
};

/** Result of {@link classifyThermalAnomaly}. */
export type ThermalClassification = {
  /** IEC TS 62446-3 class of abnormality: 1 none, 2 thermal abnormality, 3 safety-relevant; null when conditions were too poor. */
  readonly classOfAbnormality: 1 | 2 | 3 | null;
  /** True when the irradiance was below the minimum for thermography. */
  readonly isConditionsTooPoor: boolean;
  /** ΔT scaled linearly to the reference irradiance (1000 W/m²), K; null when conditions were too poor. */
  readonly scaledDeltaTC: number | null;
  /** One sentence for the technician. */
  readonly reason: string;
};

/**
 * Classifies an infrared anomaly into the classes of abnormality (CoA) of IEC TS 62446-3:2017
 * (pv-field-testing §8). Below 600 W/m² in the module plane (c-Si) the image cannot be judged and
 * the result says so. Otherwise ΔT is scaled to 1000 W/m² (ΔT·1000/G) and compared with the
 * practice thresholds: < 10 K CoA 1, 10–20 K CoA 2, ≥ 20 K CoA 3 (common practice, no source;
 * configurable). A warm substring or module of ≥ 3 K is at least CoA 2, as a dead cell-string runs
 * ≈ 6–7 K warm at 1000 W/m² (derived, §11 item 24); a hot connector or junction box from the CoA 2
 * threshold is CoA 3 (fire risk); an absolute temperature ≥ 100 °C is CoA 3.
 * Throws a RangeError on invalid input.
 */
export function classifyThermalAnomaly(input: ThermalAnomalyInput): ThermalClassification {
  const t = { ...DEFAULT_TOLERANCES.thermal, ...input.thresholds };
  assertNumber(input.deltaTC, 'deltaTC', { min: 0, max: 300 });
  assertNumber(input.irradianceWm2, 'irradianceWm2', { min: 0, max: 2000 });
  if (input.maxTempC !== undefined) assertNumber(input.maxTempC, 'maxTempC', { min: -60, max: 400 });
  const pattern = input.pattern ?? 'other';
  if (input.irradianceWm2 < t.minIrradianceWm2) {
    return {
      classOfAbnormality: null,
      isConditionsTooPoor: true,
      scaledDeltaTC: null,
      reason: `Irradiance was ${input.irradianceWm2.toFixed(0)} W/m², below the ${t.minIrradianceWm2.toFixed(0)} W/m² needed for thermography, so repeat the image in steady sun with the modules under load.`,
    };
  }
  const scaled = (input.deltaTC * t.referenceIrradianceWm2) / input.irradianceWm2;
  const dT = `ΔT is ${input.deltaTC.toFixed(1)} K at ${input.irradianceWm2.toFixed(0)} W/m² (${scaled.toFixed(1)} K at ${t.referenceIrradianceWm2.toFixed(0)} W/m²)`;
  const result = (coa: 1 | 2 | 3, why: string): ThermalClassification => ({
    classOfAbnormality: coa,
    isConditionsTooPoor: false,
    scaledDeltaTC: scaled,
    reason: `${dT}: ${why}.`,
  });
  if (input.maxTempC !== undefined && input.maxTempC >= t.absoluteLimitC) {
    return result(
      3,
      `the spot reaches ${input.maxTempC.toFixed(0)} °C, near the limit of backsheet and encapsulant, so it is safety-relevant (CoA 3) — act soon`,
    );
  }
  if ((pattern === 'hot-connector' || pattern === 'warm-junction-box') && scaled >= t.coa2DeltaTC) {
    return result(
      3,
      `a hot ${pattern === 'hot-connector' ? 'connector' : 'junction box'} is a fire risk, so it is safety-relevant (CoA 3) — check the contact or bypass diodes soon`,
    );
  }
  if (scaled >= t.coa3DeltaTC) {
    return result(
      3,
      `at or above ${t.coa3DeltaTC.toFixed(0)} K the anomaly is safety-relevant (CoA 3) — act soon`,
    );
  }
  if (scaled >= t.coa2DeltaTC) {
    return result(
      2,
      `between ${t.coa2DeltaTC.toFixed(0)} and ${t.coa3DeltaTC.toFixed(0)} K it is a thermal abnormality (CoA 2) — investigate and monitor the yield loss`,
    );
  }
  if ((pattern === 'warm-substring' || pattern === 'warm-module') && scaled >= t.deadSubstringDeltaTC) {
    return result(
      2,
      `a uniformly warm ${pattern === 'warm-substring' ? 'substring' : 'module'} that much above its neighbours is not producing power (a bypassed, shorted or open cell-string), a thermal abnormality (CoA 2) — measure its Voc`,
    );
  }
  return result(1, `below ${t.coa2DeltaTC.toFixed(0)} K there is no abnormality to act on (CoA 1)`);
}
