import { describe, expect, it } from 'vitest';
import { daysAgo } from './labels';

describe('time since the last screen in words (our choice)', () => {
  it('says today and yesterday rather than 0 and 1 days', () => {
    expect(daysAgo(0)).toBe('today');
    expect(daysAgo(1)).toBe('yesterday');
  });
  it('counts days from two on', () => {
    expect(daysAgo(2)).toBe('2 days ago');
    expect(daysAgo(81)).toBe('81 days ago');
  });
  it('says so when the screen is dated ahead of today', () => {
    expect(daysAgo(-1)).toBe('in 1 day');
    expect(daysAgo(-87)).toBe('in 87 days');
  });
});
