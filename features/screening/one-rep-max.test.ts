import { describe, expect, it } from 'vitest';
import { ONE_REP_MAX_CHECK_RATIO, ONE_REP_MAX_CHECK_WITHOUT_MASS_KG, oneRepMaxWarning } from './one-rep-max';

describe('oneRepMaxWarning (our choice: question a 1RM above 1.5 times the body mass)', () => {
  it('is quiet up to 1.5 times the body mass, or without a 1RM', () => {
    expect(ONE_REP_MAX_CHECK_RATIO).toBe(1.5);
    expect(oneRepMaxWarning(57, 38)).toBeNull(); // exactly 1.5 x 38
    expect(oneRepMaxWarning(30, 41)).toBeNull();
    expect(oneRepMaxWarning(null, 38)).toBeNull();
    expect(oneRepMaxWarning(null, null)).toBeNull();
  });
  it('without a body mass, questions a 1RM above 100 kg (our choice) and asks for the mass', () => {
    expect(ONE_REP_MAX_CHECK_WITHOUT_MASS_KG).toBe(100);
    expect(oneRepMaxWarning(100, null)).toBeNull();
    expect(oneRepMaxWarning(45, undefined)).toBeNull();
    expect(oneRepMaxWarning(300, null)).toBe(
      "A 300 kg 1RM is more than most juniors lift, and no body mass is on record to check it against. Check that it is this athlete's split-squat 1RM, in kg, and enter the body mass, before any load is lifted: every loaded exercise is a share of it.",
    );
    expect(oneRepMaxWarning(100.5, 0)).toMatch(/^A 100.5 kg 1RM is more than most juniors lift/);
  });
  it('asks to check a 1RM above it, saying by how much', () => {
    // 1.5 x 38 = 57 kg
    expect(oneRepMaxWarning(200, 38)).toBe(
      "A 200 kg 1RM is more than 1.5 times the body mass (38 kg). Check that it is this athlete's split-squat 1RM, in kg, before any load is lifted: every loaded exercise is a share of it.",
    );
    expect(oneRepMaxWarning(57.5, 38)).toMatch(/^A 57.5 kg 1RM is more than 1.5 times/);
  });
});
