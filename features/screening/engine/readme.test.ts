import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tableInReadme, thresholdTableMarkdown } from './threshold-doc';
import { THRESHOLDS } from './thresholds';

const readme = readFileSync(join(__dirname, 'README.md'), 'utf8');

describe('the engine README lists every threshold as the table holds it', () => {
  it('its generated section equals the output of the generator (run `npm run docs:thresholds` after changing a threshold)', () => {
    expect(tableInReadme(readme)).toBe(thresholdTableMarkdown());
  });

  it.each(THRESHOLDS.map((r) => [r.id, r] as const))('%s appears with its value, kind and certainty', (id, r) => {
    const line = readme.split('\n').find((l) => l.startsWith(`| \`${id}\` |`));
    expect(line).toBeDefined();
    expect(line).toContain(String(r.value));
    expect(line).toContain(` ${r.certainty} `);
  });

  it('points at no file outside the repository', () => {
    expect(readme).not.toMatch(/\/work\/|\/tmp\/|\/root\//);
  });
});
