/**
 * Dutymark hydraulic engine — public face. Pure TypeScript, SI units inside
 * (m³/s, m, Pa, W, m, kg/m³, Pa·s, m²/s; temperature in °C at the surface), no framework
 * and no platform APIs: runs in the server and the browser alike. See README.md.
 */
// Modules whose every export is public: what they export is what the engine offers, so a helper for
// tests or for other engine modules alone belongs elsewhere (robustness.test.ts fails for a new exported
// function without its sweep entry).
export * from "./units.ts";
export * from "./fluids.ts";
export * from "./pipes.ts";
export * from "./headLoss.ts";
export * from "./fittings.ts";
export * from "./system.ts";
export * from "./roots.ts";
export * from "./operatingPoint.ts";
export * from "./affinity.ts";
export * from "./multiple.ts";
export * from "./figures.ts";
export * from "./fieldCheck.ts";
export * from "./gradeUncertainty.ts";
export * from "./gradePower.ts";
export * from "./verdict.ts";
export * from "./motor.ts";
export * from "./lifeCycleCost.ts";
export * from "./viscous.ts";
// Modules that also export helpers for the engine's own use: only these names are public.
export { EngineInputError, type EngineWarning } from "./errors.ts";
export {
  colebrook, colebrookResidual, swameeJain, haaland, churchill, laminar, hazenWilliamsHeadLoss, fullyRoughFrictionFactor,
} from "./friction.ts";
export {
  CORRELATIONS, FRICTION_METHODS, findCorrelation,
  type Correlation, type DarcyCorrelation, type HeadLossCorrelation, type FrictionMethod, type Range,
} from "./registry.ts";
export { monotoneCubic, evalCubic, type MonotoneCubic } from "./interp.ts";
export { DROOP_MAX, PEAK_BY } from "./headShape.ts";
export {
  createPumpCurve, ensurePumpCurve, headAt, efficiencyAt, shaftPowerAt, npshrAt, flowsAtHead, sampleCurve, POR_FRACTION, RISE_TOLERANCE_DEFAULT,
  type PumpPoint, type PumpCurveInput, type PumpCurve, type BestEfficiencyPoint, type SampledCurve,
} from "./pumpCurve.ts";
export { NPSHR_END_ROUNDING } from "./npshrEnds.ts";
export { prepareSearchIndex, joinSearchIndexes, type CurveSet, type SearchIndex } from "./searchIndex.ts";
export { searchDuty, type SearchOptions, type Candidate, type SearchResult } from "./search.ts";
export { explainRanks } from "./searchExplain.ts";
export {
  dutyCycleEnergy, defaultCirculatorProfile, CONTROL_MODES, CIRCULATOR_PROFILE_SHARES, CIRCULATOR_PROFILE_SOURCE, PROPORTIONAL_ZERO_FLOW,
  MAX_FLOW_FRACTION, MAX_STEPS, MOTOR_PART_LOAD, DRIVE_PART_LOAD, PART_LOAD_SOURCE, COUNTED_STEP_STATUSES, NEVER_RUN_NOTE,
  type ControlMode, type DutyStep, type DutyCycleInput, type DutyCycleResult, type StepResult, type StepStatus,
} from "./dutyCycle.ts";
export {
  stagedDutyCycleEnergy, PARALLEL_STAGING_RULE, type StagedDutyCycleInput,
} from "./dutyStaging.ts";
export { STEP_MIN_FLOW_FRACTION, STEP_POR_RULE, STEP_MIN_FLOW_RULE, STEP_POR_CODES, STEP_BELOW_MAKER_MIN_FLOW, STEP_MAKER_MIN_FLOW_RULE, type StepPorWarning, type StepMakerMinWarning } from "./stepPor.ts";
