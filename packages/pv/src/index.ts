// Public interface of @stringfield/pv. Internal helpers (root finding, Bishop solver, fitting
// utilities) are deliberately not re-exported.
export type { CurvePoints, IvPoint, ModuleSpec, ReverseBiasParams, SingleDiodeParams } from './types.ts';
export { ENGINE_VERSION } from './engine-version.ts';
export {
  DEFAULT_TOLERANCES,
  type StringCheckTolerances,
  type ThermalThresholds,
} from './default-tolerances.ts';
export { SIMULATION_DEFAULTS } from './simulation-defaults.ts';
export { PHYSICS } from './physical-constants.ts';
export { cellTemperature, type CellTemperatureInput } from './cell-temperature.ts';
export { expectedString, type ExpectedStringInput } from './expected-string.ts';
export { necVoltageCorrectionFactor } from './nec-voltage-correction-factor.ts';
export { maxStringVoc, type MaxStringVoc, type MaxStringVocInput } from './max-string-voc.ts';
export {
  checkStringSizing,
  SIZING_CHECKS,
  type SizingCheck,
  type SizingCheckName,
  type StringSizingInput,
  type StringSizingResult,
} from './check-string-sizing.ts';
export { fitSingleDiode, type SingleDiodeFit } from './fit-single-diode.ts';
export { singleDiodeParamsAt } from './single-diode-params-at.ts';
export { translateDeSoto, type OperatingCondition } from './translate-desoto.ts';
export { singleDiodeCurrent } from './single-diode-current.ts';
export { singleDiodeVoltage } from './single-diode-voltage.ts';
export { solveSingleDiode } from './solve-single-diode.ts';
export { lambertWLog } from './lambert-w-log.ts';
export {
  simulateString,
  type ShadedCell,
  type SimulateStringInput,
  type SimulatedString,
} from './simulate-string.ts';
export { translateToStc, type TranslateToStcInput, type TranslatedCurve } from './translate-to-stc.ts';
export {
  analyzeCurve,
  type AnalyzeCurveOptions,
  type CurveAnalysis,
  type CurveStep,
} from './analyze-curve.ts';
export {
  diagnoseStringCheck,
  FINDING_CODES,
  type Finding,
  type FindingCode,
  type StringCheckInput,
  type StringCheckResult,
} from './diagnose-string-check.ts';
export {
  classifyThermalAnomaly,
  THERMAL_PATTERNS,
  type ThermalAnomalyInput,
  type ThermalClassification,
  type ThermalPattern,
} from './classify-thermal-anomaly.ts';
export {
  insulationResistanceRequirement,
  type InsulationRequirement,
} from './insulation-resistance-requirement.ts';
