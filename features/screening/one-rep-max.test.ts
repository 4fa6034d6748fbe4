import { describe, expect, it } from 'vitest';
import { ONE_REP_MAX_CHECK_RATIO, oneRepMaxWarning } from './one-rep-max';

describe('oneRepMaxWarning (our choice: question a 1RM above 1.5 times the body mass)', () => {
  it('is quiet up to 1.5 times the body mass, or without both figures', () => {
    expect(ONE_REP_MAX_CHECK_RATIO).toBe(1.5);
    expect(oneRepMaxWarning(57, 38)).toBeNull(); // exactly 1.5 x 38
    expect(oneRepMaxWarning(30, 41)).toBeNull();
    expect(oneRepMaxWarning(200, null)).toBeNull();
    expect(oneRepMaxWarning(null, 38)).toBeNull();
  });
  it('asks to check a 1RM above it, saying by how much', () => {
    // 1.5 x 38 = 57 kg
    expect(oneRepMaxWarning(200, 38)).toBe(
      "A 200 kg 1RM is more than 1.5 times the body mass (38 kg). Check that it is this athlete's split-squat 1RM, in kg, before any load is lifted: every loaded exercise is a share of it.",
    );
    expect(oneRepMaxWarning(57.5, 38)).toMatch(/^A 57.5 kg 1RM is more than 1.5 times/);
  });
});
