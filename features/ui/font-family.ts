// Native: the names under which the fonts are registered.
export const FONT_FAMILY = { regular: 'SquadlineSans_400Regular', bold: 'SquadlineSans_700Bold' } as const;
