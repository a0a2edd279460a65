import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { cellTemperature } from './cell-temperature.ts';
import { DEFAULT_TOLERANCES } from './default-tolerances.ts';
import { expectedString } from './expected-string.ts';
import { formatNumber } from './format-number.ts';
import { maxStringVoc } from './max-string-voc.ts';
import { SIMULATION_DEFAULTS } from './simulation-defaults.ts';
import type { ModuleSpec } from './types.ts';

/** Names of the checks made by {@link checkStringSizing}. */
export const SIZING_CHECKS = [
  'COLD_VOC_BELOW_MAX_DC',
  'HOT_VMP_ABOVE_MPPT_MIN',
  'HOT_VMP_ONE_SUBSTRING_BYPASSED_ABOVE_MPPT_MIN',
  'COLD_VMP_BELOW_MPPT_MAX',
  'HOT_VMP_ABOVE_START',
  'OPERATING_CURRENT_WITHIN_MAX_INPUT',
  'MAX_CIRCUIT_CURRENT_WITHIN_LIMIT',
  'POWER_WITHIN_ENVELOPE',
] as const;
/** One of {@link SIZING_CHECKS}. */
export type SizingCheckName = (typeof SIZING_CHECKS)[number];

/** One named sizing check. */
export type SizingCheck = {
  readonly name: SizingCheckName;
  readonly ok: boolean;
  /** The computed value, in `unit`. */
  readonly value: number;
  /** The limit it is compared with, in `unit`. */
  readonly limit: number;
  readonly unit: 'V' | 'A' | 'W';
  /** One sentence for the designer or technician. */
  readonly message: string;
};

/** Input of {@link checkStringSizing}. */
export type StringSizingInput = {
  readonly module: ModuleSpec;
  /** Modules in series per string. */
  readonly modulesInSeries: number;
  /** Strings in parallel on this inverter input (MPPT). */
  readonly stringsInParallel: number;
  readonly inverterInput: {
    /** Maximum DC input voltage, V. */
    readonly maxDcV: number;
    /** MPPT window, V. */
    readonly mpptMinV: number;
    readonly mpptMaxV: number;
    /** Start-up voltage, V. */
    readonly startV?: number;
    /** Maximum operating input current, A. */
    readonly maxInputA: number;
    /** Maximum short-circuit input current, A (if not given, the 1.25·Isc current is compared with maxInputA). */
    readonly maxShortCircuitA?: number;
    /** Maximum DC input power of this input, W. */
    readonly maxPowerW?: number;
  };
  readonly site: {
    /** Lowest expected ambient temperature, °C (ASHRAE extreme minimum by convention). */
    readonly lowestAmbientC: number;
    /** Highest expected ambient temperature, °C (e.g. ASHRAE 2 % design). */
    readonly highestAmbientC: number;
    /** Irradiance for the hot-day and power checks, W/m² (default 1000). */
    readonly designIrradianceWm2?: number;
  };
};

/** Result of {@link checkStringSizing}. */
export type StringSizingResult = {
  /** True when every check is ok. */
  readonly ok: boolean;
  readonly checks: SizingCheck[];
  /** NEC 690.8(A)(1) maximum circuit current (strings × Isc × 1.25), A. */
  readonly maxCircuitCurrentA: number;
  /** NEC 690.8(B) basis for conductor ampacity and fuse rating (× 1.25 again, 1.56 × Isc), A. */
  readonly minConductorAmpacityA: number;
};

/**
 * Checks a string design against an inverter input (pv-field-testing §4 and §1):
 * - cold Voc (NEC 690.7(A)(1) coefficient method at the lowest ambient) ≤ maximum DC voltage;
 * - hot Vmp (single-diode model at the highest ambient plus the NOCT rise at the design irradiance)
 *   ≥ MPPT minimum, also with one substring bypassed (minus one substring and one diode drop);
 * - cold Vmp (cell at the lowest ambient, 1000 W/m²) ≤ MPPT maximum; hot Vmp ≥ start voltage;
 * - operating current (strings × Imp) ≤ maximum input current, and the NEC 690.8(A)(1) maximum
 *   circuit current (strings × Isc × 1.25) ≤ maximum short-circuit current;
 * - STC array power ≤ the inverter's envelope at the STC Vmp: min(Pmax, Imax·V) between the MPPT
 *   minimum and maximum (the constant-power curve P/V), zero outside.
 * The module's NOCT defaults to 45 °C (from memory). Local codes and licensed practice rule.
 * Throws a RangeError on invalid input.
 */
export function checkStringSizing(input: StringSizingInput): StringSizingResult {
  const { module, modulesInSeries: n, stringsInParallel: p, inverterInput: inv, site } = input;
  assertModuleSpec(module);
  assertNumber(n, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  assertNumber(p, 'stringsInParallel', { integer: true, min: 1, max: 1000 });
  assertNumber(inv.maxDcV, 'inverterInput.maxDcV', { greaterThan: 0 });
  assertNumber(inv.mpptMinV, 'inverterInput.mpptMinV', { min: 0 });
  assertNumber(inv.mpptMaxV, 'inverterInput.mpptMaxV', { greaterThan: inv.mpptMinV });
  assertNumber(inv.maxInputA, 'inverterInput.maxInputA', { greaterThan: 0 });
  if (inv.startV !== undefined) assertNumber(inv.startV, 'inverterInput.startV', { min: 0 });
  if (inv.maxShortCircuitA !== undefined)
    assertNumber(inv.maxShortCircuitA, 'inverterInput.maxShortCircuitA', { greaterThan: 0 });
  if (inv.maxPowerW !== undefined) assertNumber(inv.maxPowerW, 'inverterInput.maxPowerW', { greaterThan: 0 });
  assertNumber(site.lowestAmbientC, 'site.lowestAmbientC', { min: -60, max: 50 });
  assertNumber(site.highestAmbientC, 'site.highestAmbientC', { min: site.lowestAmbientC, max: 60 });
  const g = site.designIrradianceWm2 ?? 1000;
  assertNumber(g, 'site.designIrradianceWm2', { greaterThan: 0, max: 1500 });

  const noctC = module.noctC ?? DEFAULT_TOLERANCES.sizing.defaultNoctC;
  const hotCellC = cellTemperature({ ambientC: site.highestAmbientC, irradianceWm2: g, noctC });
  const hot = expectedString({ module, modulesInSeries: n, irradianceWm2: g, moduleTempC: hotCellC });
  const cold = expectedString({
    module,
    modulesInSeries: n,
    irradianceWm2: 1000,
    moduleTempC: site.lowestAmbientC,
  });
  const stc = expectedString({ module, modulesInSeries: n, irradianceWm2: 1000, moduleTempC: 25 });
  const coldVoc = maxStringVoc({
    module,
    modulesInSeries: n,
    lowestAmbientC: site.lowestAmbientC,
    method: 'coefficient',
  });
  const hotBypassedVmpV =
    hot.vmpV - hot.vmpV / (n * module.bypassDiodes) - SIMULATION_DEFAULTS.bypassDiodeDropV;
  const f1 = DEFAULT_TOLERANCES.sizing.necMaxCurrentFactor;
  const f2 = DEFAULT_TOLERANCES.sizing.necContinuousFactor;
  const maxCircuitCurrentA = p * module.iscA * f1;
  const operatingA = p * stc.impA;
  const arrayPowerW = p * stc.pmpW;
  const v = (x: number): string => `${formatNumber(x, 1)} V`;
  const a = (x: number): string => `${formatNumber(x, 2)} A`;
  const w = (x: number): string => `${formatNumber(x, 0)} W`;

  const checks: SizingCheck[] = [];
  const add = (
    name: SizingCheckName,
    value: number,
    limit: number,
    unit: SizingCheck['unit'],
    ok: boolean,
    message: string,
  ): void => {
    checks.push({ name, ok, value, limit, unit, message });
  };
  add(
    'COLD_VOC_BELOW_MAX_DC',
    coldVoc.maxVocV,
    inv.maxDcV,
    'V',
    coldVoc.maxVocV <= inv.maxDcV,
    `At ${formatNumber(site.lowestAmbientC, 0)} °C the string's Voc rises to ${v(coldVoc.maxVocV)} (NEC 690.7(A)(1)), ${coldVoc.maxVocV <= inv.maxDcV ? 'within' : 'above'} the inverter's ${v(inv.maxDcV)} maximum${coldVoc.maxVocV <= inv.maxDcV ? '.' : ', so remove modules from the string.'}`,
  );
  add(
    'HOT_VMP_ABOVE_MPPT_MIN',
    hot.vmpV,
    inv.mpptMinV,
    'V',
    hot.vmpV >= inv.mpptMinV,
    `On a ${formatNumber(site.highestAmbientC, 0)} °C day (cells near ${formatNumber(hotCellC, 0)} °C) Vmp falls to ${v(hot.vmpV)}, ${hot.vmpV >= inv.mpptMinV ? 'above' : 'below'} the ${v(inv.mpptMinV)} MPPT minimum${hot.vmpV >= inv.mpptMinV ? '.' : ', so the inverter will lose power: add modules.'}`,
  );
  add(
    'HOT_VMP_ONE_SUBSTRING_BYPASSED_ABOVE_MPPT_MIN',
    hotBypassedVmpV,
    inv.mpptMinV,
    'V',
    hotBypassedVmpV >= inv.mpptMinV,
    `With one substring bypassed on a hot day Vmp is about ${v(hotBypassedVmpV)}, ${hotBypassedVmpV >= inv.mpptMinV ? 'still above' : 'below'} the ${v(inv.mpptMinV)} MPPT minimum${hotBypassedVmpV >= inv.mpptMinV ? '.' : ', so partial shade will drop the string out of tracking.'}`,
  );
  add(
    'COLD_VMP_BELOW_MPPT_MAX',
    cold.vmpV,
    inv.mpptMaxV,
    'V',
    cold.vmpV <= inv.mpptMaxV,
    `With cells at ${formatNumber(site.lowestAmbientC, 0)} °C in full sun Vmp rises to ${v(cold.vmpV)}, ${cold.vmpV <= inv.mpptMaxV ? 'inside' : 'above'} the ${v(inv.mpptMaxV)} MPPT maximum${cold.vmpV <= inv.mpptMaxV ? '.' : ', so the inverter will track off the maximum-power point on cold days.'}`,
  );
  if (inv.startV !== undefined) {
    add(
      'HOT_VMP_ABOVE_START',
      hot.vmpV,
      inv.startV,
      'V',
      hot.vmpV >= inv.startV,
      `Hot-day Vmp of ${v(hot.vmpV)} is ${hot.vmpV >= inv.startV ? 'above' : 'below'} the inverter's ${v(inv.startV)} start voltage${hot.vmpV >= inv.startV ? '.' : ', so it may not start or may drop out: add modules.'}`,
    );
  }
  add(
    'OPERATING_CURRENT_WITHIN_MAX_INPUT',
    operatingA,
    inv.maxInputA,
    'A',
    operatingA <= inv.maxInputA,
    `${p} string(s) deliver ${a(operatingA)} at maximum power, ${operatingA <= inv.maxInputA ? 'within' : 'above'} the ${a(inv.maxInputA)} input limit${operatingA <= inv.maxInputA ? '.' : ', so the inverter will clip the current.'}`,
  );
  const scLimit = inv.maxShortCircuitA ?? inv.maxInputA;
  add(
    'MAX_CIRCUIT_CURRENT_WITHIN_LIMIT',
    maxCircuitCurrentA,
    scLimit,
    'A',
    maxCircuitCurrentA <= scLimit,
    `The maximum circuit current is ${a(maxCircuitCurrentA)} (${p} × Isc × 1.25, NEC 690.8(A)(1)), ${maxCircuitCurrentA <= scLimit ? 'within' : 'above'} the inverter's ${a(scLimit)} ${inv.maxShortCircuitA === undefined ? 'input' : 'short-circuit'} limit${maxCircuitCurrentA <= scLimit ? '.' : ', so use fewer strings on this input.'}`,
  );
  if (inv.maxPowerW !== undefined) {
    const inWindow = stc.vmpV >= inv.mpptMinV && stc.vmpV <= inv.mpptMaxV;
    const envelopeW = inWindow ? Math.min(inv.maxPowerW, inv.maxInputA * stc.vmpV) : 0;
    add(
      'POWER_WITHIN_ENVELOPE',
      arrayPowerW,
      envelopeW,
      'W',
      arrayPowerW <= envelopeW,
      inWindow
        ? `At ${v(stc.vmpV)} the inverter takes up to ${w(envelopeW)} (the smaller of ${w(inv.maxPowerW)} and ${a(inv.maxInputA)} × V) and the array makes ${w(arrayPowerW)} at STC${arrayPowerW <= envelopeW ? '.' : ', so expect clipping on clear days.'}`
        : `The STC Vmp of ${v(stc.vmpV)} lies outside the ${v(inv.mpptMinV)}–${v(inv.mpptMaxV)} MPPT window, so the inverter cannot take the array's ${w(arrayPowerW)} at full power.`,
    );
  }
  return {
    ok: checks.every((c) => c.ok),
    checks,
    maxCircuitCurrentA,
    minConductorAmpacityA: maxCircuitCurrentA * f2,
  };
}
