import { describe, expect, it } from 'vitest';
import { heldWithPainToday, LANDING_TASK, painEarlierToday } from './pain-today';

// Our choice (with the usual rule of stopping a screen on pain, common practice, no source): pain ticked on a
// task holds the landing task that follows it in the same screen.
describe('pain earlier in the same screen', () => {
  it('lists the tasks before this one, in the battery order, where pain was ticked', () => {
    const tasks = { 'single-leg-squat-left': { criteria: [], painReported: true }, 'two-leg-squat': { criteria: ['squat-heels-lift'] } };
    expect(painEarlierToday(tasks, 'single-leg-squat-right')).toEqual(['single-leg-squat-left']);
    expect(painEarlierToday(tasks, LANDING_TASK)).toEqual(['single-leg-squat-left']);
    // The task itself and the tasks before the pain are not held by it.
    expect(painEarlierToday(tasks, 'single-leg-squat-left')).toEqual([]);
    expect(painEarlierToday(tasks, 'two-leg-squat')).toEqual([]);
  });

  it('holds the landing task in the review after pain before it, not after pain that came later', () => {
    expect(heldWithPainToday([], { 'two-leg-squat': { criteria: [], painReported: true } })).toEqual([LANDING_TASK]);
    // Pain on the lunge (the last task) comes after the landing: the landing was already run.
    expect(heldWithPainToday([], { 'racket-side-lunge': { criteria: [], painReported: true } })).toEqual([]);
    // Held already from an earlier screen: listed once.
    expect(heldWithPainToday([LANDING_TASK], { 'two-leg-squat': { criteria: [], painReported: true } })).toEqual([LANDING_TASK]);
  });
});
