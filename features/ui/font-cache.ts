/** Native: the fonts are files inside the app. */
export function keepFontsForNextVisit(): void {}
