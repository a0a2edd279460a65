import type { CurvePoints } from '@stringfield/pv';

/** The inverter input figures of a datasheet that bound where a string may operate. */
export type InverterInputSpec = {
  maxDcV: number;
  mpptMinV: number;
  mpptMaxV: number;
  startV: number;
  mpptInputs: number;
  /** Maximum operating current of one input, A. */
  maxInputA: number;
  /** Maximum DC power of the whole inverter, W. */
  maxDcW: number;
};

/**
 * The window one string sees: voltages are shared by every string on the input, so they stay;
 * current and power of the input are split over the strings in parallel on it. The input's power
 * is the inverter's DC maximum divided over its MPPT inputs (P = maxDcW / mpptInputs).
 */
export type StringWindow = {
  mpptMinV: number;
  mpptMaxV: number;
  maxDcV: number;
  startV: number;
  /** This string's share of the input's maximum current, A. */
  maxCurrentA: number;
  /** This string's share of the input's power limit, W. */
  maxPowerW: number;
  /** Strings in parallel on the input that share the current and power. */
  stringsInParallel: number;
};

export function stringWindow(inverter: InverterInputSpec, stringsInParallel: number): StringWindow {
  const sharing = Math.max(1, Math.round(stringsInParallel));
  return {
    mpptMinV: inverter.mpptMinV,
    mpptMaxV: inverter.mpptMaxV,
    maxDcV: inverter.maxDcV,
    startV: inverter.startV,
    maxCurrentA: inverter.maxInputA / sharing,
    maxPowerW: inverter.maxDcW / Math.max(1, inverter.mpptInputs) / sharing,
    stringsInParallel: sharing,
  };
}

export type MppPosition = 'below-mppt-min' | 'inside' | 'above-mppt-max';

export type MppVerdict = {
  position: MppPosition;
  /** The MPP lies inside the MPPT window and within the current and power share. */
  isInsideWindow: boolean;
  isOverCurrent: boolean;
  /** The inverter would clip: the string makes more than its share of the input's power. */
  isOverPower: boolean;
  /** Open-circuit voltage above the inverter's maximum DC voltage: a hazard, not only a loss. */
  isVocOverMaxDc: boolean;
};

/** Where a (modelled) maximum-power point falls against the window. */
export function judgeMpp(point: Pick<CurvePoints, 'vmpV' | 'impA' | 'pmpW' | 'vocV'>, window: StringWindow): MppVerdict {
  const position: MppPosition =
    point.vmpV < window.mpptMinV ? 'below-mppt-min' : point.vmpV > window.mpptMaxV ? 'above-mppt-max' : 'inside';
  const isOverCurrent = point.impA > window.maxCurrentA;
  const isOverPower = point.pmpW > window.maxPowerW;
  return {
    position,
    isInsideWindow: position === 'inside' && !isOverCurrent && !isOverPower,
    isOverCurrent,
    isOverPower,
    isVocOverMaxDc: point.vocV > window.maxDcV,
  };
}

/**
 * The constant-power limit drawn between MPPT minimum and maximum: I = min(maxCurrent, P / V).
 * `steps` segments, voltage ascending, in V, A and W.
 */
export function powerLimitCurve(window: StringWindow, steps = 24): { voltageV: number; currentA: number; powerW: number }[] {
  const points: { voltageV: number; currentA: number; powerW: number }[] = [];
  const span = window.mpptMaxV - window.mpptMinV;
  if (!(span > 0) || steps < 1) return points;
  for (let k = 0; k <= steps; k += 1) {
    const voltageV = window.mpptMinV + (span * k) / steps;
    const currentA = Math.min(window.maxCurrentA, window.maxPowerW / voltageV);
    points.push({ voltageV, currentA, powerW: currentA * voltageV });
  }
  return points;
}

/** Evenly spaced picks from a curve (first and last kept), for a readable data table. */
export function sampleCurve<T>(curve: readonly T[], count: number): T[] {
  if (curve.length <= count || count < 2) return [...curve];
  const picked: T[] = [];
  for (let k = 0; k < count; k += 1) {
    const item = curve[Math.round((k * (curve.length - 1)) / (count - 1))];
    if (item !== undefined) picked.push(item);
  }
  return picked;
}
