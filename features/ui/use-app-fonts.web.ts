import { FontDisplay, loadAsync } from 'expo-font';
import { FONT_SOURCES } from './font-sources';

const FONTS = Object.fromEntries(Object.entries(FONT_SOURCES).map(([name, uri]) => [name, { uri, display: FontDisplay.OPTIONAL }]));
let started = false;

/**
 * Web: never waits for the fonts. While pages are pre-rendered (Node, no `window`), every page registers
 * them, so its HTML carries the @font-face rules and a preload link for each file, fetched at once beside
 * the scripts. `font-display: optional` uses the face only if it is there within the first moment of the
 * page, and otherwise keeps the system face for that visit: text never jumps when a font arrives late on
 * a slow hall connection, and the next visit has the files in its cache.
 */
export function useAppFonts(): boolean {
  const prerendering = typeof window === 'undefined';
  if (prerendering || !started) {
    if (!prerendering) started = true;
    loadAsync(FONTS).catch(() => undefined);
  }
  return true;
}
