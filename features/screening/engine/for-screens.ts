/**
 * What screens need from the engine, without the scoring code: the test battery, the landmarks, the
 * exercise library, the geometry behind the live angles on a photo, and a few constants. Screens import
 * from here, so the browser does not download and evaluate the whole engine with them (an assessment is
 * scored on the server). Everything else comes from `index.ts`; types may keep coming from there.
 */
export { BATTERY, TASK_IDS, getTask, type TaskSpec, type ViewSpec, type CriterionSpec } from './battery';
export { LANDMARKS, getLandmark, type LandmarkSpec } from './landmarks';
export { EXERCISES } from './exercises';
export { frontalPlaneProjectionAngle, kneeFlexion, pelvicObliquity, tibialInclination, trunkLean } from './geometry';
export { strengthEnduranceLoad } from './strength';
export { MATURITY_AGE_RANGE } from './maturity';
export { DEFAULT_LOAD_INCREMENT_KG } from './validate';
