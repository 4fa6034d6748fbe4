// Where Squadline serves the pose model from: its own origin, under a path carrying the package version so
// the files can be cached for a year. The server's route reads the same constants (server/pose-model/).

/** The npm package holding the model files and their runtime (Apache-2.0). Pinned exactly in package.json. */
export const POSE_PACKAGE = '@mediapipe/pose';
export const POSE_PACKAGE_VERSION = '0.5.1675469404';
export const POSE_MODEL_BASE = `/pose-model/${POSE_PACKAGE_VERSION}`;
