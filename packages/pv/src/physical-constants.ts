/**
 * Physical constants and reference conditions used across the engine.
 * CODATA 2018 exact values; STC per IEC 60904-3 (1000 W/m², 25 °C cell temperature).
 */
export const PHYSICS = {
  /** Boltzmann constant over elementary charge, V/K (numerically equal to k in eV/K). */
  boltzmannOverChargeVPerK: 1.380649e-23 / 1.602176634e-19,
  /** 0 °C in kelvin. */
  zeroCelsiusK: 273.15,
  /** STC irradiance, W/m². */
  stcIrradianceWm2: 1000,
  /** STC cell temperature, °C. */
  stcCellTempC: 25,
  /** Silicon bandgap at 25 °C, eV (De Soto 2006, as in pvlib calcparams_desoto). */
  siliconBandgapEv: 1.121,
  /** Relative temperature coefficient of the bandgap, 1/K (De Soto 2006, as in pvlib calcparams_desoto). */
  siliconBandgapPerK: -0.0002677,
} as const;
