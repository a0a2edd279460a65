/**
 * Default tolerances and thresholds of the engine. Every value the reference sheet tags
 * `from memory` or `common practice` lives here so a site can override it; confirmed values are
 * here too so a stored verdict can say which numbers it used (see ENGINE_VERSION).
 */
export const DEFAULT_TOLERANCES = {
  stringCheck: {
    /** Voc pass band around the expected value, % (IEC 62446 style 5 %; pv-field-testing §7). */
    vocPct: 5,
    /** Isc pass band around the expected value, % (IEC 62446 style 5 %; pv-field-testing §7). */
    iscPct: 5,
    /** Agreement between identical strings, % (IEC 62446:2009 §5.4.4, confirmed; §11 item 26). */
    peerPct: 5,
    /** Fewest peer strings for a peer median (common practice, no source). */
    minPeers: 2,
    /** Below this irradiance Voc is not judged, W/m² (common practice, no source). */
    minIrradianceForVocWm2: 200,
    /** Below this irradiance Isc is not judged, W/m² (IEC 62446-1 I-V test ≥ 400 W/m², from memory). */
    minIrradianceForIscWm2: 400,
    /** Largest irradiance change during the test, ± % of the mean (common practice, no source; §3.3). */
    maxIrradianceChangePct: 2,
    /** Voc below this fraction of expected reads as an open circuit (common practice, no source; §7). */
    openCircuitVocFraction: 0.05,
    /** Isc below this fraction of expected, with Voc present, reads as an open current path (common practice, no source). */
    openCircuitIscFraction: 0.05,
    /** Largest residual when counting bypassed substrings, × substring Voc (common practice, no source; §7). */
    substringResidualFraction: 0.3,
    /** Largest residual when counting missing or extra modules, × module Voc (common practice, no source; §7). */
    moduleResidualFraction: 0.15,
  },
  thermal: {
    /** ΔT (scaled to 1000 W/m²) from which an anomaly is CoA 2, K (common practice, no source; §8). */
    coa2DeltaTC: 10,
    /** ΔT (scaled to 1000 W/m²) from which an anomaly is CoA 3, K (common practice, no source; §8). */
    coa3DeltaTC: 20,
    /** A warm substring or module this much above its neighbours is a dead cell-string, K (derived ≈ 6–7 K at 1000 W/m², §8 / §11 item 24; threshold common practice). */
    deadSubstringDeltaTC: 3,
    /** Absolute temperature that makes any anomaly CoA 3, °C (backsheet/encapsulant limits ≈ 100–120 °C, common practice). */
    absoluteLimitC: 100,
    /** Minimum plane-of-array irradiance for thermography of c-Si, W/m² (IEC TS 62446-3, §11 item 28). */
    minIrradianceWm2: 600,
    /** Irradiance ΔT is scaled to, W/m² (common practice, no source). */
    referenceIrradianceWm2: 1000,
  },
  sizing: {
    /** NOCT assumed when the datasheet gives none, °C (typical 42–48 °C, from memory). */
    defaultNoctC: 45,
    /** NEC 690.8(A)(1) maximum-current factor (confirmed). */
    necMaxCurrentFactor: 1.25,
    /** NEC 690.8(B) continuous-duty factor for conductors and fuses (confirmed). */
    necContinuousFactor: 1.25,
  },
} as const;

/** Tolerances accepted by `diagnoseStringCheck` (any subset overrides the defaults). */
export type StringCheckTolerances = { -readonly [K in keyof typeof DEFAULT_TOLERANCES.stringCheck]: number };
/** Thresholds accepted by `classifyThermalAnomaly` (any subset overrides the defaults). */
export type ThermalThresholds = { -readonly [K in keyof typeof DEFAULT_TOLERANCES.thermal]: number };
