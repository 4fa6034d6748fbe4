import { describe, expect, it } from 'vitest';
import { ONE_REP_MAX_CHECK_RATIO, ONE_REP_MAX_CHECK_WITHOUT_MASS_KG, oneRepMaxWarning, usableOneRepMax } from './one-rep-max';

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

// our choice: a questioned 1RM sets no load until the tester confirms that very value; loads then use
// bodyweight, as with no 1RM.
describe('usableOneRepMax', () => {
  it('uses a 1RM the check does not question', () => {
    expect(usableOneRepMax({ oneRepMaxKg: 30, body: { massKg: 41 } })).toBe(30);
    expect(usableOneRepMax({ oneRepMaxKg: null, body: { massKg: 41 } })).toBeNull();
    expect(usableOneRepMax({ body: {} })).toBeNull();
  });
  it('leaves out a questioned 1RM until that value is confirmed', () => {
    // 90 kg for a 40 kg child: above 1.5 x 40 = 60 kg.
    expect(usableOneRepMax({ oneRepMaxKg: 90, body: { massKg: 40 } })).toBeNull();
    expect(usableOneRepMax({ oneRepMaxKg: 90, oneRepMaxCheckedKg: 90, body: { massKg: 40 } })).toBe(90);
    // Confirmed, then changed: the new value is questioned again.
    expect(usableOneRepMax({ oneRepMaxKg: 95, oneRepMaxCheckedKg: 90, body: { massKg: 40 } })).toBeNull();
    // Without a body mass, above 100 kg.
    expect(usableOneRepMax({ oneRepMaxKg: 120, body: {} })).toBeNull();
    expect(usableOneRepMax({ oneRepMaxKg: 120, oneRepMaxCheckedKg: 120, body: {} })).toBe(120);
  });
});
