// The first chunk (all the JavaScript the sign-in page loads before it responds) must stay within the
// budget the README states. `npm test` builds the web export before vitest runs, so this checks the
// current sources. Sizes are gzip -9 of each file: stable across machines, unlike timings.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstChunk, kb, readmeBudgetKb } from '../bench/bundle-sizes.mjs';

const ROOT = path.resolve(__dirname, '../..');
const DIST = path.resolve(ROOT, process.env.SQUADLINE_DIST ?? 'dist');

type Chunk = { html: string; gzip: number; scripts: { src: string; gzip: number }[] };

describe('first-chunk budget', () => {
  it('reads the budget from the README', () => {
    expect(readmeBudgetKb('… First-chunk budget: **123 KB** of gzip …')).toBe(123);
    expect(() => readmeBudgetKb('no budget here')).toThrow(/First-chunk budget/);
  });

  it('keeps the sign-in page’s JavaScript within the README’s budget', () => {
    expect(fs.existsSync(DIST), `No web export at ${DIST}: run \`npm test\` (it builds one) or \`npm start\`.`).toBe(true);
    const budgetKb: number = readmeBudgetKb(fs.readFileSync(path.join(ROOT, 'README.md'), 'utf8'));
    const chunk = firstChunk(DIST) as Chunk;
    expect(chunk.html).toBe('sign-in.html');
    expect(chunk.scripts.length).toBeGreaterThan(0);
    const detail = chunk.scripts.map((s) => `${s.src}: ${kb(s.gzip)}`).join('\n');
    expect(chunk.gzip / 1024, `First chunk ${kb(chunk.gzip)} (gzip -9) is over the README's budget of ${budgetKb} KB:\n${detail}`).toBeLessThanOrEqual(
      budgetKb,
    );
  });
});
