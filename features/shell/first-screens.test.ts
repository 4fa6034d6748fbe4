import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// What the signed-in first screens import, read from the sources: the form libraries (formik, yup and
// every schema built with them) belong to the screens with a form. A home that imported one label from
// the auth schemas built yup and all of them on every signed-in page (a Chromium profile, 4x slower CPU:
// yup was a sixth of one long task). Our choice, from that measurement.

const ROOT = path.resolve(__dirname, '..', '..');
const SUFFIXES = ['.web.tsx', '.web.ts', '.tsx', '.ts', '/index.tsx', '/index.ts'];

/** The file an import names, null for a package, undefined when nothing matches. */
function resolveImport(from: string, spec: string): string | null | undefined {
  const base = spec.startsWith('@/') ? path.join(ROOT, spec.slice(2)) : spec.startsWith('.') ? path.resolve(path.dirname(from), spec) : null;
  if (base === null) return null;
  return SUFFIXES.map((s) => base + s).find((p) => fs.existsSync(p) && fs.statSync(p).isFile());
}

const IMPORT = /^\s*(?:import|export)\s+(type\s+)?(?:(\{[^}]*\}|[\w*\s,{}]+?)\s+from\s+)?'([^']+)'/gm;

/** Every package the files import, directly or through our own files, with the first file that does. */
function packagesReached(entries: readonly string[]): Map<string, string> {
  const seen = new Set<string>();
  const packages = new Map<string, string>();
  const visit = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    for (const [, typeOnly, names, spec] of fs.readFileSync(file, 'utf8').matchAll(IMPORT)) {
      if (typeOnly || (names?.startsWith('{') && /^\{\s*(type\s+\w+(\s+as\s+\w+)?\s*,?\s*)+\}$/.test(names))) continue; // erased
      const target = resolveImport(file, spec!);
      if (target === null) {
        const name = spec!.startsWith('@') ? spec!.split('/').slice(0, 2).join('/') : spec!.split('/')[0]!;
        if (!packages.has(name)) packages.set(name, path.relative(ROOT, file));
      } else if (target) visit(target);
    }
  };
  for (const entry of entries) visit(path.join(ROOT, entry));
  return packages;
}

describe('the signed-in first screens (our choice)', () => {
  it('finds the form libraries where a form is (the check can fail)', () => {
    const reached = packagesReached(['app/(public)/sign-in.tsx']);
    expect(reached.has('formik')).toBe(true);
    expect(reached.has('yup')).toBe(true);
  });

  // The round list is left out: on a wide screen its form stands beside the rounds from the first render.
  it('every role home, its layouts and the shell import neither formik nor yup', () => {
    const reached = packagesReached(['app/(club)/index.tsx', 'app/_layout.tsx', 'app/(club)/_layout.tsx', 'features/shell/components/club-shell.tsx']);
    expect(reached.get('yup')).toBeUndefined();
    expect(reached.get('formik')).toBeUndefined();
  });
});
