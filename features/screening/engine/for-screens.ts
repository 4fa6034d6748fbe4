/**
 * What screens need from the engine, without the scoring code: the test battery, the landmarks, the
 * threshold table, the geometry behind the live angles on a photo, and a few constants. Screens import
 * from here, so the browser does not download and evaluate the whole engine with them (an assessment is
 * scored on the server). Everything else comes from `index.ts`; types may keep coming from there.
 * Screens outside screening (the progress charts) take what they need from here too: one `index.ts`
 * import from a second lazily loaded screen puts the whole scoring code in the chunk every page loads.
 * Only what two or more screens use belongs here: the exercise library and the input validation are used
 * by the result screen alone (through `index.ts`), and stay in that screen's chunk.
 */
export { BATTERY, TASK_IDS, getTask, type TaskSpec, type ViewSpec, type CriterionSpec } from './battery';
export { LANDMARKS, getLandmark, type LandmarkSpec } from './landmarks';
export { frontalPlaneProjectionAngle, kneeFlexion, pelvicObliquity, tibialInclination, trunkLean } from './geometry';
export { MATURITY_AGE_RANGE } from './maturity';
export { DEFAULT_RESCREEN_WEEKS } from './defaults';
export { THRESHOLDS } from './thresholds';
