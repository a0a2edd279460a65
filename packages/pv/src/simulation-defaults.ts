/**
 * Defaults of `simulateString`.
 * - `reverse`: Bishop (1988) breakdown parameters of a conventional c-Si cell, as in pvlib's
 *   partial-shading example (a = 2e-3, m = 3, Vbr = −15 V; pv-field-testing §6.1, confirmed).
 * - `bypassDiodeDropV`: forward drop of a Schottky bypass diode at rated current, ≈ 0.4–0.55 V
 *   (§6.2, from memory); p-n rectifiers drop ≈ 0.7–1.0 V.
 * - `points`: points on the returned curve.
 */
export const SIMULATION_DEFAULTS = {
  reverse: { breakdownV: -15, a: 2e-3, m: 3 },
  bypassDiodeDropV: 0.5,
  points: 400,
} as const;
