// Reads a V8 .cpuprofile (`node --cpu-prof`, e.g. from `npm run bench:api -- --cpu-prof DIR`) and prints
// the functions with the most self time and the most inclusive time (self plus everything they called),
// as a share of the samples, with their file and line. Recursion is counted once per stack.
//
//   node test/bench/cpu-profile.mjs DIR/CPU.*.cpuprofile [--top 40] [--match progress]
import fs from 'node:fs';

const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args.splice(i, 2)[1] : fallback;
};
const TOP = Number(option('top', 40));
const MATCH = option('match', null);
const files = args;
if (!files.length) {
  console.error('Usage: node test/bench/cpu-profile.mjs FILE.cpuprofile [--top N] [--match TEXT]');
  process.exit(2);
}

for (const file of files) {
  const profile = JSON.parse(fs.readFileSync(file, 'utf8'));
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const label = (n) => {
    const f = n.callFrame;
    const where = f.url ? `${f.url.replace(/^file:\/\//, '').replace(/^.*node_modules\//, '~/')}:${f.lineNumber + 1}:${f.columnNumber + 1}` : '';
    return `${f.functionName || '(anonymous)'} ${where}`.trim();
  };
  const samplesOf = new Map();
  for (const id of profile.samples) samplesOf.set(id, (samplesOf.get(id) ?? 0) + 1);
  const self = new Map();
  const inclusive = new Map();
  let total = 0;
  let idle = 0;
  for (const [id, count] of samplesOf) {
    const node = byId.get(id);
    const name = label(node);
    total += count;
    if (name === '(idle)' || name === '(program)') idle += name === '(idle)' ? count : 0;
    self.set(name, (self.get(name) ?? 0) + count);
    const seen = new Set();
    for (let cur = id; cur !== undefined; cur = parent.get(cur)) {
      const l = label(byId.get(cur));
      if (seen.has(l)) continue;
      seen.add(l);
      inclusive.set(l, (inclusive.get(l) ?? 0) + count);
    }
  }
  const busy = total - idle;
  const pct = (n) => `${((100 * n) / busy).toFixed(1).padStart(5)}%`;
  const print = (title, map) => {
    console.log(`\n${title} (share of ${busy} busy samples of ${total}; ${file})`);
    [...map]
      .filter(([name]) => name !== '(idle)' && (!MATCH || name.includes(MATCH)))
      .sort((a, b) => b[1] - a[1])
      .slice(0, TOP)
      .forEach(([name, n]) => console.log(`${pct(n)}  ${name}`));
  };
  print('Self time', self);
  print('Inclusive time', inclusive);
}
