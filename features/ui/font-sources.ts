// Only the weights the app uses: a Latin subset of Source Sans 3, renamed Squadline Sans (fonts/README.md,
// SIL Open Font License, fonts/OFL.txt).
export const FONT_SOURCES = {
  SquadlineSans_400Regular: require('@/fonts/SquadlineSans-Regular.ttf'),
  SquadlineSans_700Bold: require('@/fonts/SquadlineSans-Bold.ttf'),
} as const;
