import { describe, expect, it } from 'vitest';
import { BATTERY } from '@/features/screening/engine/battery';
import { BEFORE_EACH_ATHLETE, MEASURE_FIRST } from './before-each-athlete';

// A phone takes the largest text painted as the page's main content (Largest Contentful Paint). The
// capture screen's checks are painted from the HTML at once; a step's texts only after the JavaScript and
// the assessment. So every paragraph a step shows without a tap (what to look at, the measuring lines,
// each criterion) stays at most three quarters of the checks' length, both wrapped in boxes of about the
// same width (our choice of margin). "How to run it" opens on a tap, and a phone stops at the first tap.
describe("the capture screen's checks stay the largest text painted", () => {
  const limit = (BEFORE_EACH_ATHLETE.text.length * 3) / 4;

  it.each(BATTERY.map((t) => [t.id, t] as const))('%s', (_id, task) => {
    expect(task.lookFor.length).toBeLessThanOrEqual(limit);
    for (const c of task.criteria) expect(c.text.length).toBeLessThanOrEqual(limit);
    for (const s of task.safety) expect(s.length).toBeLessThanOrEqual(limit);
  });

  it('the measuring lines of the body step', () => {
    for (const line of MEASURE_FIRST) expect(line.length).toBeLessThanOrEqual(limit);
  });
});
