import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';

const require = createRequire(import.meta.url);
const indexFile = require.resolve('react-native-web/dist/index.js');
const shim = fs.readFileSync(path.join(__dirname, 'react-native-lazy.js'), 'utf8');

/** name -> file under dist/exports, as React Native Web's index re-exports them. */
function indexExports(): Map<string, string> {
  const source = fs.readFileSync(indexFile, 'utf8');
  const all = [...source.matchAll(/^export\s*\{([^}]*)\}\s*from\s*['"]\.\/exports\/([\w-]+)['"];?$/gm)];
  const found = new Map<string, string>();
  for (const [, names, file] of all) {
    for (const spec of names!.split(',')) {
      const m = /^\s*default\s+as\s+(\w+)\s*$/.exec(spec);
      if (!m) throw new Error(`React Native Web's index re-exports something other than a default: ${spec}`);
      found.set(m[1]!, file!);
    }
  }
  return found;
}

describe("the lazy stand-in for React Native Web's index", () => {
  it('has every export of the installed index, from the same file, and nothing else', () => {
    const expected = indexExports();
    expect(expected.size).toBeGreaterThan(50);
    // Every export statement of the index is one we read (none skipped by the pattern above).
    expect(fs.readFileSync(indexFile, 'utf8').match(/^export /gm)).toHaveLength(expected.size);
    const lazy = new Map(
      [...shim.matchAll(/^lazy\('(\w+)', \(\) => require\('react-native-web\/dist\/exports\/([\w-]+)'\)\.default\);$/gm)].map((m) => [m[1]!, m[2]!]),
    );
    expect(lazy).toEqual(expected);
    expect(shim.match(/^lazy\(/gm)).toHaveLength(lazy.size);
    for (const file of lazy.values()) expect(fs.existsSync(path.join(path.dirname(indexFile), 'exports', file))).toBe(true);
  });

  it('loads nothing until an export is read, then only that one', () => {
    const loaded: string[] = [];
    const exports: Record<string, unknown> = {};
    const fakeRequire = (id: string) => {
      loaded.push(id);
      return { default: `the ${id.replace(/^.*\//, '')} export` };
    };
    new Function('exports', 'require', shim)(exports, fakeRequire);
    expect(loaded).toEqual([]);
    expect(exports.__esModule).toBe(true);
    expect(Object.keys(exports)).toHaveLength(indexExports().size);
    expect(exports.View).toBe('the View export');
    expect(exports.unstable_createElement).toBe('the createElement export');
    expect(loaded).toEqual(['react-native-web/dist/exports/View', 'react-native-web/dist/exports/createElement']);
  });
});
