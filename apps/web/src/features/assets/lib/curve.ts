import type { IvPoint } from '@stringfield/pv';

/**
 * Current on an I-V curve at a voltage, by straight lines between the points (voltage ascending,
 * as `simulateString` returns them); 0 A beyond Voc, Isc below 0 V.
 */
export function currentAt(curve: readonly IvPoint[], voltageV: number): number {
  const first = curve[0];
  const last = curve[curve.length - 1];
  if (!first || !last) return 0;
  if (voltageV <= first.voltageV) return first.currentA;
  if (voltageV >= last.voltageV) return 0;
  let lo = 0;
  let hi = curve.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((curve[mid]?.voltageV ?? 0) <= voltageV) lo = mid;
    else hi = mid;
  }
  const p = curve[lo];
  const q = curve[hi];
  if (!p || !q) return 0;
  const span = q.voltageV - p.voltageV;
  const w = span > 0 ? (voltageV - p.voltageV) / span : 0;
  return p.currentA + w * (q.currentA - p.currentA);
}

export type CurveTableRow = { voltageV: number; healthyA: number; modelledA: number };

/** Both curves read at the same `count` voltages from 0 V to the healthy Voc, for a table a screen reader can walk. */
export function curveTable(healthy: readonly IvPoint[], modelled: readonly IvPoint[], count = 13): CurveTableRow[] {
  const vocV = healthy[healthy.length - 1]?.voltageV ?? 0;
  if (!(vocV > 0) || count < 2) return [];
  return Array.from({ length: count }, (_, k) => {
    const voltageV = (vocV * k) / (count - 1);
    return { voltageV, healthyA: currentAt(healthy, voltageV), modelledA: currentAt(modelled, voltageV) };
  });
}
