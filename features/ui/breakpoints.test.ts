import { describe, expect, it } from 'vitest';
import { getBreakpoints } from './breakpoints.shared';

describe('getBreakpoints', () => {
  it.each([
    [360, { isPhone: true, isTabletUp: false, isWide: false }],
    [390, { isPhone: true, isTabletUp: false, isWide: false }],
    [700, { isPhone: false, isTabletUp: true, isWide: false }],
    [1023, { isPhone: false, isTabletUp: true, isWide: false }],
    [1024, { isPhone: false, isTabletUp: true, isWide: true }],
    [1440, { isPhone: false, isTabletUp: true, isWide: true }],
  ])('width %i', (width, expected) => {
    expect(getBreakpoints(width)).toEqual(expected);
  });
});
