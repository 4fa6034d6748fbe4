import { describe, expect, it } from 'vitest';
import { evaluateAssessment, EngineInputError } from '@/features/screening/engine';
import { refusalWords } from './refusal-words';

// Our wording. The messages are the engine's own refusals, made here, not copied.
function refusal(landmarks: Record<string, { x: number; y: number }>): string {
  try {
    evaluateAssessment({ athlete: { sex: 'female', ageYears: 12 }, tasks: { 'two-leg-squat': { criteria: [], photos: { front: { landmarks } } } } });
  } catch (e) {
    if (e instanceof EngineInputError) return e.message;
  }
  throw new Error('not refused');
}

describe("the measuring desk's words for a refused save", () => {
  it('names a swapped pair of hip centres or front hip bones in words', () => {
    expect(refusalWords(refusal({ 'right-hip': { x: 560, y: 700 }, 'left-hip': { x: 400, y: 700 } }))).toBe(
      "The right and left hip centres are the wrong way round: facing the camera, the athlete's right is on the photo's left. Drag them to their sides.",
    );
    expect(refusalWords(refusal({ 'right-asis': { x: 560, y: 650 }, 'left-asis': { x: 400, y: 650 } }))).toContain(
      'front hip bones (ASIS) are the wrong way round',
    );
  });

  it('leaves any other refusal as it is', () => {
    expect(refusalWords('The assessment was changed on another device.')).toBe('The assessment was changed on another device.');
  });
});
