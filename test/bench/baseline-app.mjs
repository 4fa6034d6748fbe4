// The yardstick of `npm run bench:web`: an empty two-route Expo Router app, written into the git-ignored
// .tmp/ folder, built with the same `node_modules` (so the same SDK and versions), the same output mode and
// the same export command as Squadline, then precompressed like Squadline's export. Rebuilt only when its
// sources, Squadline's output mode or the lock file change.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { precompressExport } from '../../server/dev/precompress.mjs';

const FILES = {
  'package.json': JSON.stringify({ name: 'empty-router-app', private: true, main: 'expo-router/entry' }, null, 2),
  // Node resolution walks up from .tmp/ to the project's node_modules; Metro needs to be told to look there.
  'metro.config.js': [
    "const path = require('node:path');",
    "const { getDefaultConfig } = require('expo/metro-config');",
    'const config = getDefaultConfig(__dirname);',
    'const modules = path.resolve(__dirname, process.env.BASELINE_NODE_MODULES);',
    'config.watchFolders = [modules];',
    'config.resolver.nodeModulesPaths = [modules];',
    'module.exports = config;',
  ].join('\n'),
  'app/_layout.js': ["import { Slot } from 'expo-router';", 'export default function Layout() { return <Slot />; }'].join('\n'),
  'app/index.js': [
    "import { Link } from 'expo-router';",
    "import { Text, View } from 'react-native';",
    'export default function Home() {',
    '  return (',
    "    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', gap: 16 }}>",
    '      <Text style={{ fontSize: 24 }}>Home</Text>',
    '      <Link href="/second">Second page</Link>',
    '    </View>',
    '  );',
    '}',
  ].join('\n'),
  'app/second.js': [
    "import { Link } from 'expo-router';",
    "import { Text, View } from 'react-native';",
    'export default function Second() {',
    '  return (',
    "    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', gap: 16 }}>",
    '      <Text style={{ fontSize: 24 }}>Second page</Text>',
    '      <Link href="/">Home</Link>',
    '    </View>',
    '  );',
    '}',
  ].join('\n'),
};

/** Builds (when needed) and returns the export folder of the empty app. */
export async function buildBaselineApp(root) {
  const dir = path.join(root, '.tmp', 'bench-baseline');
  const dist = path.join(dir, 'dist');
  // Squadline's output mode, read from its config text (Node cannot import a .ts file).
  const output = /output:\s*'(\w+)'/.exec(fs.readFileSync(path.join(root, 'app.config.ts'), 'utf8'))?.[1] ?? 'single';
  const appJson = {
    expo: {
      name: 'empty-router-app',
      slug: 'empty-router-app',
      scheme: 'empty-router-app',
      web: { bundler: 'metro', output },
      plugins: ['expo-router'],
    },
  };
  const files = { ...FILES, 'app.json': JSON.stringify(appJson, null, 2) };
  const hash = createHash('sha256');
  for (const [name, text] of Object.entries(files)) hash.update(name).update(text);
  hash.update(fs.readFileSync(path.join(root, 'package-lock.json')));
  const want = hash.digest('hex');
  const stamp = path.join(dist, '.source-hash');
  if (fs.existsSync(stamp) && fs.readFileSync(stamp, 'utf8') === want) return dist;

  fs.rmSync(dir, { recursive: true, force: true });
  for (const [name, text] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(dir, name)), { recursive: true });
    fs.writeFileSync(path.join(dir, name), text + '\n');
  }
  console.log('Building the empty Expo Router app for comparison (expo export, about a minute)...');
  const tmp = path.join(root, '.tmp');
  const result = spawnSync(path.join(root, 'node_modules', '.bin', 'expo'), ['export', '--platform', 'web', '--output-dir', 'dist'], {
    cwd: dir,
    stdio: 'inherit',
    env: {
      ...process.env,
      CI: '1',
      TMPDIR: tmp,
      EXPO_NO_TELEMETRY: '1',
      BASELINE_NODE_MODULES: path.relative(dir, path.join(root, 'node_modules')),
      NODE_PATH: path.join(root, 'node_modules'),
    },
  });
  if (result.status !== 0) throw new Error('Building the empty Expo Router app failed.');
  precompressExport(dist);
  fs.writeFileSync(stamp, want);
  return dist;
}
