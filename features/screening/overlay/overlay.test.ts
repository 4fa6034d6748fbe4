import { describe, expect, it } from 'vitest';
import { getTask } from '@/features/screening/engine';
import { overlayFor } from './overlay';

// Worked examples from the definitions (image pixels, y down; front view: the athlete's right leg on the
// image's left, so its midline is towards +x).
describe('overlayFor', () => {
  it('front view: the right knee drawn towards the midline gives a positive FPPA (valgus)', () => {
    const o = overlayFor(getTask('two-leg-squat'), 'front', {
      'right-hip': { x: 100, y: 100 },
      'right-knee': { x: 110, y: 200 },
      'right-ankle': { x: 100, y: 300 },
    });
    const fppa = o.angles.find((a) => a.id === 'fppa-right-knee');
    // Thigh (10, 100) and shank (-10, 100): 2 x atan(10/100) = 11.42 degrees.
    expect(fppa?.value).toBeCloseTo(11.42, 2);
    expect(fppa?.short).toBe('R 11.4°');
    expect(o.lines.map((l) => l.style)).toEqual(['limb', 'limb', 'reference']);
  });

  it.each([
    // stance left, the right (free) ASIS 10 px lower over 100 px: atan(0.1) = 5.71 degrees of drop.
    ['single-leg-squat-left', { 'left-asis': { x: 200, y: 100 }, 'right-asis': { x: 100, y: 110 } }, 'pelvic-obliquity', 5.71],
    // two-leg: magnitude only
    ['two-leg-squat', { 'left-asis': { x: 200, y: 110 }, 'right-asis': { x: 100, y: 100 } }, 'pelvic-tilt', 5.71],
  ] as const)('%s pelvis', (task, marks, id, expected) => {
    const o = overlayFor(getTask(task), 'front', marks);
    expect(o.angles.find((a) => a.id === id)?.value).toBeCloseTo(expected, 2);
  });

  it('side view: knee flexion and shin angle', () => {
    const o = overlayFor(getTask('two-leg-squat'), 'side', {
      'near-hip': { x: 0, y: 0 },
      'near-knee': { x: 100, y: 0 },
      'near-ankle': { x: 100, y: 100 },
    });
    expect(o.angles.find((a) => a.id === 'knee-flexion')?.value).toBeCloseTo(90, 6);
    expect(o.angles.find((a) => a.id === 'tibial-inclination')?.value).toBeCloseTo(0, 6);
  });

  it('reports impossible placements instead of throwing', () => {
    const o = overlayFor(getTask('drop-landing'), 'front', {
      'left-hip': { x: 100, y: 300 },
      'left-knee': { x: 100, y: 200 },
      'left-ankle': { x: 100, y: 100 },
    });
    expect(o.angles).toHaveLength(0);
    expect(o.problems[0]).toMatch(/^Left knee: /);
  });
});
