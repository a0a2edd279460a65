import { simulateString, type IvPoint } from '@stringfield/pv';
import type { StringSpec } from './string-spec';

/**
 * Keeps at most `max` points of a curve, evenly by index, always with the first and last: a tracer's
 * 20,000 points would only slow the chart without showing more.
 */
export function downsample(points: readonly IvPoint[], max = 300): IvPoint[] {
  if (points.length <= max) return [...points];
  const step = (points.length - 1) / (max - 1);
  return Array.from({ length: max }, (_, k) => points[Math.round(k * step)]!);
}

/**
 * What a healthy string of this datasheet traces at the trace's irradiance and cell temperature
 * (Bishop model, every bypass diode idle); null when the engine refuses the inputs.
 */
export function healthyCurveAt(spec: StringSpec, irradianceWm2: number, cellTempC: number, points = 150): { curve: IvPoint[]; pmpW: number } | null {
  if (!(irradianceWm2 > 0) || !Number.isFinite(cellTempC)) return null;
  try {
    const s = simulateString({ module: spec.module, modulesInSeries: spec.modulesInSeries, irradianceWm2, moduleTempC: cellTempC, points });
    return { curve: s.curve, pmpW: s.pmpW };
  } catch {
    return null;
  }
}

/** The measured maximum power as a share of the healthy string's, %; null without a model. */
export function powerRatioPct(measuredPmpW: number, healthyPmpW: number | null | undefined): number | null {
  if (!healthyPmpW || healthyPmpW <= 0) return null;
  return (measuredPmpW / healthyPmpW) * 100;
}
