// Web: the same faces with system fallbacks, shown until Source Sans 3 has arrived (font-display: swap).
const FALLBACK = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
export const FONT_FAMILY = {
  regular: `SourceSans3_400Regular, ${FALLBACK}`,
  bold: `SourceSans3_700Bold, ${FALLBACK}`,
} as const;
