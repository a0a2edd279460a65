/**
 * A module datasheet at STC (1000 W/m², 25 °C cell, AM1.5G).
 *
 * Temperature coefficients are relative, in %/°C, as printed on datasheets: `betaVocPctPerC: -0.29`
 * means Voc falls by 0.29 % per kelvin. `cellsInSeries` is the number of cells in series in one module
 * (a 120 half-cell module with two parallel halves counts 60). `cellsInSeries` must split evenly over
 * `bypassDiodes` (one cell-string, or substring, per diode).
 */
export type ModuleSpec = {
  /** Rated maximum power at STC, W. */
  readonly pmaxW: number;
  /** Open-circuit voltage at STC, V. */
  readonly vocV: number;
  /** Short-circuit current at STC, A. */
  readonly iscA: number;
  /** Maximum-power voltage at STC, V. */
  readonly vmpV: number;
  /** Maximum-power current at STC, A. */
  readonly impA: number;
  /** Isc temperature coefficient, %/°C (typically +0.03 … +0.06). */
  readonly alphaIscPctPerC: number;
  /** Voc temperature coefficient, %/°C (typically −0.24 … −0.36). */
  readonly betaVocPctPerC: number;
  /** Pmax temperature coefficient, %/°C (typically −0.26 … −0.45). Informational; the single-diode model predicts power itself. */
  readonly gammaPmaxPctPerC: number;
  /** Cells in series in one module (60, 72, …). */
  readonly cellsInSeries: number;
  /** Bypass diodes per module (usually 3). */
  readonly bypassDiodes: number;
  /** Nominal operating cell temperature, °C (typically 42–48). */
  readonly noctC?: number;
};

/** One point of an I-V curve: voltage in V, current in A. */
export type IvPoint = { readonly voltageV: number; readonly currentA: number };

/**
 * The five parameters of the single-diode model
 * `I = IL − I0·[exp((V + I·Rs)/a) − 1] − (V + I·Rs)/Rsh` at one operating condition.
 */
export type SingleDiodeParams = {
  /** IL, photocurrent, A (≥ 0). */
  readonly photoCurrentA: number;
  /** I0, diode saturation current, A (> 0). */
  readonly saturationCurrentA: number;
  /** Rs, series resistance, Ω (≥ 0). */
  readonly seriesOhm: number;
  /** Rsh, shunt resistance, Ω (> 0; `Infinity` allowed). */
  readonly shuntOhm: number;
  /** a = n·Ns·k·Tc/q, the modified ideality factor of the whole device, V (> 0). */
  readonly modifiedIdealityV: number;
};

/** The characteristic points of an I-V curve. */
export type CurvePoints = {
  /** Short-circuit current, A. */
  readonly iscA: number;
  /** Open-circuit voltage, V. */
  readonly vocV: number;
  /** Current at maximum power, A. */
  readonly impA: number;
  /** Voltage at maximum power, V. */
  readonly vmpV: number;
  /** Maximum power, W. */
  readonly pmpW: number;
};

/** Bishop (1988) reverse-bias (avalanche breakdown) parameters of one cell. */
export type ReverseBiasParams = {
  /** Vbr, junction breakdown voltage, V (negative, e.g. −15). */
  readonly breakdownV: number;
  /** a, fraction of the ohmic current involved in avalanche breakdown (dimensionless, ≥ 0; 0 turns breakdown off). */
  readonly a: number;
  /** m, avalanche breakdown exponent (dimensionless, > 0). */
  readonly m: number;
};
