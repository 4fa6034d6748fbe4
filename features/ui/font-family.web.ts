// Web: the same faces with system fallbacks, used when the font files have not arrived in time (see
// use-app-fonts.web.ts) or for characters outside their Latin subset.
const FALLBACK = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
export const FONT_FAMILY = {
  regular: `SquadlineSans_400Regular, ${FALLBACK}`,
  // "Squadline Bold Fallback" maps to the bold cut of a common system face (declared in app/+html.tsx).
  bold: `SquadlineSans_700Bold, "Squadline Bold Fallback", ${FALLBACK}`,
} as const;
