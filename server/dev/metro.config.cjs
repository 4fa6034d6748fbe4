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

// On the web, React Native Web's index resolves to react-native-lazy.js, which loads each of its exports
// when first read instead of all of them at start (see that file). Expo's Babel preset rewrites
// `import { View } from 'react-native'` to the one export's file, but `require('react-native')` as a
// whole (the compiled CommonJS of expo-router and others) to `react-native-web/dist/index`. Expo's own
// resolvers, which map `react-native` to `react-native-web`, run after this one.
const LAZY_INDEX = path.join(__dirname, 'react-native-lazy.js'); // eslint-disable-line no-undef -- CommonJS
const WHOLE_INDEX = new Set(['react-native', 'react-native-web', 'react-native-web/dist/index']);
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (platform === 'web' && WHOLE_INDEX.has(moduleName)) {
    return { type: 'sourceFile', filePath: LAZY_INDEX };
  }
  return context.resolveRequest(context, moduleName, platform);
};
module.exports = config;
