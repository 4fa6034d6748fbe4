// ESLint: Expo's flat config (React, React Hooks, import, TypeScript parser and plugin) plus TypeScript
// rules of our own choosing. Formatting is Prettier's job (`npm run format`), checked by `npm run lint`.
const Module = require('node:module');
const path = require('node:path');
const { defineConfig } = require('eslint/config');

// typescript-eslint needs TypeScript's JavaScript API, which TypeScript 7 (the project's compiler) no longer
// ships. npm therefore nests typescript-eslint, the import resolver and a TypeScript 6 under
// eslint-config-expo, but hoists ts-api-utils to the top, where `require('typescript')` finds TypeScript 7;
// and eslint-plugin-import (hoisted) looks for the nested resolver and parser from the top. While linting,
// those requests resolve from eslint-config-expo's folder. Drop this when typescript-eslint supports TS 7.
const expoDir = path.dirname(require.resolve('eslint-config-expo/package.json'));
const fromExpo = (request) => require.resolve(request, { paths: [expoDir] });
const resolve = Module._resolveFilename;
Module._resolveFilename = function (request, parent, ...rest) {
  if (request === 'typescript' && parent?.filename && /[\\/](ts-api-utils|@typescript-eslint)[\\/]/.test(parent.filename)) {
    return fromExpo('typescript');
  }
  try {
    return resolve.call(this, request, parent, ...rest);
  } catch (error) {
    if (request === 'eslint-import-resolver-typescript' || request.startsWith('@typescript-eslint/')) return fromExpo(request);
    throw error;
  }
};

const expoConfig = require('eslint-config-expo/flat');

module.exports = defineConfig([
  expoConfig,
  {
    ignores: [
      '.expo/**',
      'expo-env.d.ts',
      'dist/**',
      '.tmp/**',
      '.data/**',
      'uploads-fake/**',
      'migrations/**',
      'node_modules/**',
      'test-results/**',
      'playwright-report/**',
    ],
  },
  {
    files: ['**/*.ts', '**/*.tsx'],
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      '@typescript-eslint/no-non-null-asserted-optional-chain': 'error',
      '@typescript-eslint/no-unsafe-function-type': 'error',
      '@typescript-eslint/no-wrapper-object-types': 'error',
      '@typescript-eslint/prefer-as-const': 'error',
      '@typescript-eslint/no-namespace': 'error',
      '@typescript-eslint/ban-ts-comment': ['error', { 'ts-expect-error': 'allow-with-description' }],
      'no-console': ['error', { allow: ['warn', 'error'] }],
      // `x != null` (null or undefined) is the one loose comparison allowed.
      eqeqeq: ['error', 'smart'],
      // `fc.integer()` and the like: a namespace-style default import is what fast-check documents.
      'import/no-named-as-default-member': 'off',
      // Rules written for the React Compiler, which Squadline does not use; the effects they flag are deliberate.
      'react-hooks/refs': 'off',
      'react-hooks/set-state-in-effect': 'off',
      'react-hooks/immutability': 'off',
      // `import type * as schema` cannot merge with the named imports of the same module.
      'import/no-duplicates': 'off',
    },
  },
  {
    // Plain-Node bootstrap and scripts: console output is their interface.
    // Browser tests and fault runs print where their screenshots and figures went.
    files: [
      'server/dev/**/*.mjs',
      'test/bench/**',
      'test/faults/**',
      'test/e2e/**',
      'features/screening/engine/bench.ts',
      'features/screening/engine/write-threshold-doc.ts',
      '*.config.*',
      'test/**/*.config.*',
    ],
    rules: { 'no-console': 'off' },
  },
  {
    // Node scripts (.mjs): Buffer beside the globals the base config already knows.
    files: ['**/*.mjs'],
    languageOptions: { globals: { Buffer: 'readonly' } },
  },
]);
