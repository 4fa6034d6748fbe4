/**
 * Public API of the screening engine. Import from here only; the other files
 * are internal and may move.
 */
export { ENGINE_VERSION } from './version';
export { EngineInputError } from './errors';

export { frontalPlaneProjectionAngle, pelvicObliquity, trunkLean, kneeFlexion, tibialInclination, thighAngle } from './geometry';
export { limbSymmetryIndex, asymmetry } from './symmetry';
export { maturityOffset, maturityBand, MATURITY_AGE_RANGE } from './maturity';
export {
  estimateOneRepMax,
  strengthEnduranceLoad,
  loadRangeKg,
  withinPercentOfOneRepMax,
  progressionStepKg,
  LOAD_PROGRESSION,
  ONE_REP_MAX_REPS,
  STRENGTH_ENDURANCE,
  type OneRepMaxFormula,
  type StrengthEnduranceLoad,
} from './strength';
export { evaluateAssessment } from './evaluate';

export { BATTERY, TASK_IDS, getTask, type TaskSpec, type ViewSpec, type CriterionSpec } from './battery';
export { LANDMARKS, getLandmark, type LandmarkSpec } from './landmarks';
export { THRESHOLDS, derivationText, type ThresholdRow, type DerivedPart } from './thresholds';
export {
  STAGE_LIMITS,
  YOUTH_VOLUME,
  STRENGTH_ENDURANCE_DEVIATION,
  exerciseLimits,
  applyLimits,
  checkExercise,
  checkPlan,
  plannedFromLibrary,
  loadingContextOf,
  loadRuleText,
  librarySpec,
  isLoadedStrengthWork,
  type ExerciseLimits,
  type LimitBreach,
  type LimitId,
  type LimitOverride,
  type StageLimits,
  type LimitBasis,
} from './limits';
export { citationsIn, shortSource, SHORT_CITATIONS } from './sources';
export { EXERCISES } from './exercises';
export { PATTERN_TITLES } from './flags';
export { MAX_EXERCISES, GROWTH_SPURT_ADJUSTMENT } from './plan';
export { DEFAULT_RESCREEN_WEEKS, DEFAULT_LOAD_INCREMENT_KG, DEFAULT_MATURITY_METHOD, swappedFrontPair } from './validate';

export type * from './types';
