// Metro's settings for the web export and `npm run dev`: Expo's defaults plus inline requires. Loaded
// through EXPO_OVERRIDE_METRO_CONFIG (set by ensureWebBuild and dev.mjs; see METRO_ENV in bootstrap.mjs),
// so the top level keeps no metro.config.js.
//
// Inline requires: each `import` becomes a `require` at the place its binding is first used, so a module
// runs when something first uses it instead of when the entry starts. Expo turns this off for the web;
// React Native apps have it on by default. Measured with a Chromium trace of the sign-in page (4x slower
// CPU): the entry chunk's evaluation fell from 0.9-1.4 s to 0.3-0.6 s, because most of the framework's
// modules are not needed for the first render (our measurement). Imports kept for their side effects
// (`import './x'`) still run in order at start.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(path.resolve(__dirname, '..', '..')); // eslint-disable-line no-undef -- CommonJS
const expoTransformOptions = config.transformer.getTransformOptions;
config.transformer.getTransformOptions = async (...args) => {
  const options = await expoTransformOptions(...args);
  return { ...options, transform: { ...options.transform, inlineRequires: true } };
};
module.exports = config;
