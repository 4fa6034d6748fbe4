// Only the weights the app uses, shipped in fonts/ (SIL Open Font License, fonts/OFL.txt).
export const FONT_SOURCES = {
  SourceSans3_400Regular: require('@/fonts/SourceSans3_400Regular.ttf'),
  SourceSans3_700Bold: require('@/fonts/SourceSans3_700Bold.ttf'),
} as const;
