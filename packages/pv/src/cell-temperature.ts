import { assertNumber } from './assert-number.ts';

/** Input of {@link cellTemperature}. */
export type CellTemperatureInput = {
  /** Ambient air temperature, °C. */
  readonly ambientC: number;
  /** Plane-of-array irradiance, W/m² (0 … 2000). */
  readonly irradianceWm2: number;
  /** Model: `'noct'` (Ross / NOCT, default) or `'faiman'` (Faiman 2008, used by IEC 61853). */
  readonly model?: 'noct' | 'faiman';
  /** NOCT of the module, °C (needed for the NOCT model; typical 42–48). */
  readonly noctC?: number;
  /** Wind speed, m/s (Faiman model; default 1 m/s, the NOCT wind). */
  readonly windMs?: number;
  /** Faiman constant heat-loss coefficient U0, W/(m²·K) (default 25.0, Faiman 2008 fit). */
  readonly u0WPerM2K?: number;
  /** Faiman wind heat-loss coefficient U1, W/(m²·K·m/s) (default 6.84, Faiman 2008 fit). */
  readonly u1WsPerM3K?: number;
};

/**
 * Estimated cell temperature, °C, from ambient temperature and irradiance.
 * - NOCT (Ross) model: Tc = Ta + (NOCT − 20)/800 · G (pvlib temperature.ross; pv-field-testing §1.2).
 * - Faiman (2008) model: Tc = Ta + G/(U0 + U1·WS), defaults U0 = 25.0, U1 = 6.84 (pvlib temperature.faiman).
 * Both are estimates for an open-rack module; a back-of-module probe is better (§1.2).
 * Throws a RangeError when an input is out of range or NOCT is missing for the NOCT model.
 */
export function cellTemperature(input: CellTemperatureInput): number {
  assertNumber(input.ambientC, 'ambientC', { min: -60, max: 70 });
  assertNumber(input.irradianceWm2, 'irradianceWm2', { min: 0, max: 2000 });
  if ((input.model ?? 'noct') === 'faiman') {
    const windMs = input.windMs ?? 1;
    const u0 = input.u0WPerM2K ?? 25.0;
    const u1 = input.u1WsPerM3K ?? 6.84;
    assertNumber(windMs, 'windMs', { min: 0, max: 60 });
    assertNumber(u0, 'u0WPerM2K', { greaterThan: 0 });
    assertNumber(u1, 'u1WsPerM3K', { min: 0 });
    return input.ambientC + input.irradianceWm2 / (u0 + u1 * windMs);
  }
  if (input.noctC === undefined) throw new RangeError('cellTemperature: the NOCT model needs noctC');
  assertNumber(input.noctC, 'noctC', { min: 20, max: 80 });
  return input.ambientC + ((input.noctC - 20) / 800) * input.irradianceWm2;
}
