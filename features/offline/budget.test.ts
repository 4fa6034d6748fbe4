import { describe, expect, it } from 'vitest';
import { budgetText, checkPhotoBudget, PHOTO_BUDGET_BYTES } from './budget';

const MB = 1024 * 1024;

describe('photo budget on the device (80 MB, our choice)', () => {
  it.each([
    // used, adding, fits, warns (from 80% = 64 MB)
    [0, 0.3 * MB, true, false],
    [63 * MB, 0.5 * MB, true, false],
    [63.8 * MB, 0.4 * MB, true, true],
    [79.7 * MB, 0.3 * MB, true, true],
    [79.8 * MB, 0.3 * MB, false, false],
    [PHOTO_BUDGET_BYTES, 1, false, false],
  ])('with %d bytes waiting, a photo of %d bytes fits: %s', (used, adding, fits, warns) => {
    const check = checkPhotoBudget(used, adding);
    expect(check.ok).toBe(fits);
    if (check.ok) expect(check.warn).toBe(warns);
    else expect(check.message).toMatch(/Connect to send them/);
  });

  it('refuses a size it cannot measure', () => {
    expect(checkPhotoBudget(0, Number.NaN).ok).toBe(false);
    expect(checkPhotoBudget(-1, 10).ok).toBe(false);
  });

  it('says how much is used', () => {
    expect(budgetText(12.44 * MB)).toBe('12.4 of 80 MB');
  });
});
