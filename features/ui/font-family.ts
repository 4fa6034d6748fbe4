// Native: the names under which the fonts are registered.
export const FONT_FAMILY = { regular: 'SourceSans3_400Regular', bold: 'SourceSans3_700Bold' } as const;
