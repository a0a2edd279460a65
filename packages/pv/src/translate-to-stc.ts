import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { fitSingleDiode } from './fit-single-diode.ts';
import { PHYSICS } from './physical-constants.ts';
import type { IvPoint, ModuleSpec } from './types.ts';

/** Input of {@link translateToStc}. */
export type TranslateToStcInput = {
  /** Measured curve, at least 2 points; Isc1 and Voc1 are read from it (V = 0 and I = 0, linear inter-/extrapolation). */
  readonly curve: readonly IvPoint[];
  /** Irradiance during the measurement, W/m² (> 0). */
  readonly irradianceWm2: number;
  /** Cell temperature during the measurement, °C. */
  readonly cellTempC: number;
  readonly module: ModuleSpec;
  /** Modules in series in the measured string (default 1). */
  readonly modulesInSeries?: number;
  /** IEC 60891 procedure. */
  readonly procedure: 1 | 2;
  /** Rs (procedure 1) or Rs′ (procedure 2) of the measured device, Ω; default: the De Soto fit's Rs × modules in series (common practice, §2.4). */
  readonly seriesOhm?: number;
  /** κ (procedure 1) or κ′ (procedure 2), Ω/K; default 0, which makes the translation approximate (§2.1). */
  readonly kappaOhmPerC?: number;
  /** a_irr of procedure 2 (dimensionless); default a/Voc1 from the fitted model, the physical value (§2.2). */
  readonly irradianceCorrection?: number;
};

/** Result of {@link translateToStc}: the translated curve and everything needed to audit it. */
export type TranslatedCurve = {
  readonly curve: IvPoint[];
  readonly procedure: 1 | 2;
  readonly fromIrradianceWm2: number;
  readonly fromCellTempC: number;
  readonly seriesOhm: number;
  readonly kappaOhmPerC: number;
  /** α used: absolute A/K (procedure 1) or relative 1/K (procedure 2). */
  readonly alpha: number;
  /** β used: absolute V/K (procedure 1) or relative 1/K (procedure 2). */
  readonly beta: number;
  /** a_irr used (procedure 2 only). */
  readonly irradianceCorrection: number | null;
  /** True when κ = 0 was assumed. */
  readonly isApproximate: boolean;
};

/**
 * Translates a measured I-V curve to STC (1000 W/m², 25 °C) by IEC 60891 (ed. 2 2009, kept in
 * ed. 3 2021 for procedure 1; pv-field-testing §2):
 * - procedure 1: I2 = I1 + Isc1·(G2/G1 − 1) + α·(T2 − T1); V2 = V1 − Rs·(I2 − I1) − κ·I2·(T2 − T1) + β·(T2 − T1),
 *   with absolute α (A/K) and β (V/K) of the string at STC;
 * - procedure 2 (2009 form): I2 = I1·(1 + α·(T2 − T1))·G2/G1;
 *   V2 = V1 + Voc1·[β·(T2 − T1) + a_irr·ln(G2/G1)] − Rs′·(I2 − I1) − κ′·I2·(T2 − T1), with relative α, β.
 * The procedure and coefficients are returned so the translation can be stored and audited.
 * Throws a RangeError on invalid input.
 */
export function translateToStc(input: TranslateToStcInput): TranslatedCurve {
  const { curve, irradianceWm2: g1, cellTempC: t1, module, procedure } = input;
  assertModuleSpec(module);
  const n = input.modulesInSeries ?? 1;
  assertNumber(n, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  assertNumber(g1, 'irradianceWm2', { greaterThan: 0, max: 2000 });
  assertNumber(t1, 'cellTempC', { min: -60, max: 120 });
  if (curve.length < 2) throw new RangeError('translateToStc needs at least 2 curve points');
  for (const [k, p] of curve.entries()) {
    assertNumber(p.voltageV, `curve[${k}].voltageV`);
    assertNumber(p.currentA, `curve[${k}].currentA`);
  }
  const fit = fitSingleDiode(module);
  const rs = input.seriesOhm ?? fit.seriesOhm * n;
  const kappa = input.kappaOhmPerC ?? 0;
  assertNumber(rs, 'seriesOhm', { min: 0 });
  assertNumber(kappa, 'kappaOhmPerC');
  const g2 = PHYSICS.stcIrradianceWm2;
  const t2 = PHYSICS.stcCellTempC;
  const dT = t2 - t1;
  const byV = [...curve].sort((p, q) => p.voltageV - q.voltageV);
  const byI = [...curve].sort((p, q) => p.currentA - q.currentA);
  const isc1 = crossing(byV.map((p) => [p.voltageV, p.currentA] as const));
  const voc1 = crossing(byI.map((p) => [p.currentA, p.voltageV] as const));
  const alphaRel = module.alphaIscPctPerC / 100;
  const betaRel = module.betaVocPctPerC / 100;
  if (procedure === 1) {
    const alpha = alphaRel * module.iscA;
    const beta = betaRel * module.vocV * n;
    return {
      curve: curve.map((p) => {
        const i2 = p.currentA + isc1 * (g2 / g1 - 1) + alpha * dT;
        return { currentA: i2, voltageV: p.voltageV - rs * (i2 - p.currentA) - kappa * i2 * dT + beta * dT };
      }),
      procedure,
      fromIrradianceWm2: g1,
      fromCellTempC: t1,
      seriesOhm: rs,
      kappaOhmPerC: kappa,
      alpha,
      beta,
      irradianceCorrection: null,
      isApproximate: kappa === 0,
    };
  }
  const aIrr =
    input.irradianceCorrection ??
    (n * fit.modifiedIdealityV * (t1 + PHYSICS.zeroCelsiusK)) / (t2 + PHYSICS.zeroCelsiusK) / voc1;
  assertNumber(aIrr, 'irradianceCorrection', { min: 0, max: 1 });
  return {
    curve: curve.map((p) => {
      const i2 = p.currentA * (1 + alphaRel * dT) * (g2 / g1);
      const v2 =
        p.voltageV +
        voc1 * (betaRel * dT + aIrr * Math.log(g2 / g1)) -
        rs * (i2 - p.currentA) -
        kappa * i2 * dT;
      return { currentA: i2, voltageV: v2 };
    }),
    procedure,
    fromIrradianceWm2: g1,
    fromCellTempC: t1,
    seriesOhm: rs,
    kappaOhmPerC: kappa,
    alpha: alphaRel,
    beta: betaRel,
    irradianceCorrection: aIrr,
    isApproximate: kappa === 0,
  };
}

/** y where x crosses 0 on a polyline sorted by x (linear interpolation, or extrapolation from the two nearest points). */
function crossing(xy: readonly (readonly [number, number])[]): number {
  let k = xy.findIndex(([x]) => x >= 0);
  if (k <= 0) k = k === 0 ? 1 : xy.length - 1;
  const [x0, y0] = xy[k - 1] ?? [0, 0];
  const [x1, y1] = xy[k] ?? [1, 0];
  if (x0 === 0) return y0;
  if (x1 === 0) return y1;
  return y0 + ((0 - x0) * (y1 - y0)) / (x1 - x0);
}
