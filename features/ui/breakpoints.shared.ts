// The one breakpoint table, pure so it can be tested without React Native.
// Screens branch on these names, never on pixel widths.
export const BREAKPOINTS = { tablet: 700, wide: 1024 } as const;

/** Widest reading column; wide screens put panels side by side instead of stretching text. */
export const CONTENT_MAX_WIDTH = 1180;

export type Breakpoints = { isPhone: boolean; isTabletUp: boolean; isWide: boolean };

export function getBreakpoints(width: number): Breakpoints {
  return {
    isPhone: width < BREAKPOINTS.tablet,
    isTabletUp: width >= BREAKPOINTS.tablet,
    isWide: width >= BREAKPOINTS.wide,
  };
}
