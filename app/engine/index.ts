/**
 * Dutymark hydraulic engine — public face. Pure TypeScript, SI units inside
 * (m³/s, m, Pa, W, m, kg/m³, Pa·s, m²/s; temperature in °C at the surface), no framework
 * and no platform APIs: runs in the server and the browser alike. See README.md.
 */
export { EngineInputError, type EngineWarning } from "./errors.ts";
export {
  G0, STANDARD_ATMOSPHERE, UNITS, UNIT_SYSTEMS, FACTORS, toSI, fromSI, convert, unitDef, unitLabel,
  type Quantity, type UnitDef, type UnitPreset,
} from "./units.ts";
export {
  waterProperties, fluidAt, customFluid, checkFluid, if97Region1Density, if97SaturationPressure, iapwsViscosity,
  WATER_RANGE_C, type Fluid, type FluidSpec, type WaterProperties,
} from "./fluids.ts";
export {
  PIPE_TABLES, MATERIALS, pipeTable, innerDiameter, material, typedDiameter,
  type PipeSize, type PipeTable, type Material,
} from "./pipes.ts";
export {
  colebrook, colebrookResidual, swameeJain, haaland, churchill, laminar, hazenWilliamsHeadLoss, fullyRoughFrictionFactor,
} from "./friction.ts";
export {
  CORRELATIONS, FRICTION_METHODS, findCorrelation,
  type Correlation, type DarcyCorrelation, type HeadLossCorrelation, type FrictionMethod, type Range,
} from "./registry.ts";
export {
  frictionFactor, frictionFactorDetailed, pipeHeadLoss, regimeOf, LAMINAR_MAX_RE, TURBULENT_MIN_RE,
  type Regime, type FrictionResult, type LossModel, type PipeLossInput, type PipeLossResult,
} from "./headLoss.ts";
export {
  FITTINGS, CRANE_FT, CRANE_FT_RANGE, TEE_BRANCH_K_2009, fitting, fittingK, fittingKDetailed, fittingFrictionFactor, sumK, sumKDetailed,
  suddenEnlargementK, suddenContractionK, type FittingDef, type FittingUse, type FittingKResult, type KModel, type SizeBand,
} from "./fittings.ts";
export {
  prepareSystem, systemHead, systemHeadFunction, systemCurve, suctionLoss,
  type PipeRunSpec, type StaticHeadSpec, type SystemSpec, type SystemCase, type PreparedSystem,
  type SystemHeadResult, type SystemCurve, type RunsLoss,
} from "./system.ts";
export { monotoneCubic, evalCubic, type MonotoneCubic } from "./interp.ts";
export { brent, bisection, type RootResult } from "./roots.ts";
export {
  createPumpCurve, ensurePumpCurve, headAt, efficiencyAt, shaftPowerAt, npshrAt, flowsAtHead, sampleCurve, POR_FRACTION,
  type PumpPoint, type PumpCurveInput, type PumpCurve, type BestEfficiencyPoint, type SampledCurve,
} from "./pumpCurve.ts";
export {
  operatingPoint, operatingPointInSystem, solveOperatingPoint,
  type OperatingPointResult, type OperatingStatus, type DutyPoint, type SimpleSystem,
} from "./operatingPoint.ts";
export {
  scaleBySpeed, scaleByTrim, speedForDuty, trimForDuty, affinityPoint, MAX_TRIM_FRACTION,
  type TrimLaw, type ScaledCurve, type RatioSolution,
} from "./affinity.ts";
export { combinePumps, flowPerPump, type Arrangement, type CombinedCurve } from "./multiple.ts";
export {
  operatingFigures, npshAvailable, maxShaftPower, DEFAULT_NPSH_MARGIN, NPSH_MARGIN_GUIDANCE,
  type FiguresInput, type OperatingFigures,
} from "./figures.ts";
export {
  fieldCheck, gaugeTdh, gradeCross, withinGrade, TOLERANCE_GRADES,
  type FieldCheckInput, type FieldCheckResult, type GaugeReading, type GradeArm, type GradeCross, type ToleranceGrade,
} from "./fieldCheck.ts";
export { prepareSearchIndex, joinSearchIndexes, type CurveSet, type SearchIndex } from "./searchIndex.ts";
export { searchDuty, type SearchOptions, type Candidate, type SearchResult } from "./search.ts";
export { explainRanks } from "./searchExplain.ts";
export {
  judgeCandidate, catalogueReasons, verdictLabel, VERDICT_STATUSES, DEFAULT_FLOW_TOLERANCE, DEFAULT_SPEED_RANGE, VERDICT_ROUNDOFF,
  type Verdict, type VerdictStatus, type VerdictInput, type BandEdge, type CatalogueLimits, type FlowTolerance, type SavingOption,
} from "./verdict.ts";
export {
  IEC_MOTOR_RATINGS_KW, MOTOR_RATINGS_SOURCE, IE_CLASSES, DEFAULT_IE_CLASS, DEFAULT_DRIVE_EFFICIENCY, MOTOR_EFFICIENCY_SOURCE, IE_EFFICIENCY_TABLE,
  nextStandardRating, suggestMotor, motorEfficiency, polesForSpeed, annualEnergy,
  type IeClass, type MotorSuggestion, type EnergyFigures,
} from "./motor.ts";
export {
  dutyCycleEnergy, defaultCirculatorProfile, CONTROL_MODES, CIRCULATOR_PROFILE_SHARES, CIRCULATOR_PROFILE_SOURCE, PROPORTIONAL_ZERO_FLOW,
  MAX_FLOW_FRACTION, MAX_STEPS, MOTOR_PART_LOAD, DRIVE_PART_LOAD, PART_LOAD_SOURCE,
  type ControlMode, type DutyStep, type DutyCycleInput, type DutyCycleResult, type StepResult, type StepStatus,
} from "./dutyCycle.ts";
export { lifeCycleCost, LCC_SOURCE, type LifeCycleInput, type LifeCycleResult } from "./lifeCycleCost.ts";
