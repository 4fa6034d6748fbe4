import { describe, expect, it } from 'vitest';
import type { Flag } from '@/features/screening/engine';
import { groupFlags, sidesText } from './flag-lines';

// Our choice: the athlete page's lines count each side at its highest severity, as the result's cards do.
const flag = (pattern: Flag['pattern'], side: Flag['side'], severity: Flag['severity'], taskId: string): Flag =>
  ({ id: `${pattern}/${taskId}/${side}`, pattern, title: pattern, taskId, side, severity, evidence: [], thresholdsMet: [] }) as unknown as Flag;

describe('flag lines of a screen on the athlete page', () => {
  it('puts a side of concern in one task and of watch in another under concern only', () => {
    const lines = groupFlags([
      flag('dynamic-knee-valgus', 'left', 'concern', 'single-leg-squat-left'),
      flag('dynamic-knee-valgus', 'left', 'watch', 'two-leg-squat'),
      flag('dynamic-knee-valgus', 'right', 'concern', 'two-leg-squat'),
    ]);
    expect(lines.map((l) => [l.flag.severity, sidesText(l.sides), l.count])).toEqual([['concern', 'both sides', 3]]);
  });

  it('keeps a side that is only of watch on its own line, after the concerns', () => {
    const lines = groupFlags([
      flag('dynamic-knee-valgus', 'left', 'watch', 'two-leg-squat'),
      flag('dynamic-knee-valgus', 'right', 'concern', 'single-leg-squat-right'),
      flag('heels-lifting', null, 'watch', 'two-leg-squat'),
    ]);
    expect(lines.map((l) => [l.flag.pattern, l.flag.severity, sidesText(l.sides)])).toEqual([
      ['dynamic-knee-valgus', 'concern', 'right side'],
      ['dynamic-knee-valgus', 'watch', 'left side'],
      ['heels-lifting', 'watch', ''],
    ]);
  });

  it('counts a finding on both sides once', () => {
    const [line] = groupFlags([flag('contralateral-pelvic-drop', 'both', 'watch', 'two-leg-squat')]);
    expect([sidesText(line!.sides), line!.count]).toEqual(['both sides', 1]);
  });
});
