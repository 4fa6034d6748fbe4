import { FontDisplay, loadAsync } from 'expo-font';
import { FONT_SOURCES } from './font-sources';

let started = false;

/**
 * Web: the page renders at once in the fallback face and Source Sans 3 swaps in when it arrives
 * (font-display: swap). The two font files weigh about 280 KB compressed; waiting for them before
 * the first paint doubled the time to a usable sign-in page on a slow phone connection.
 */
export function useAppFonts(): boolean {
  if (!started) {
    started = true;
    const fonts = Object.fromEntries(
      Object.entries(FONT_SOURCES).map(([name, uri]) => [name, { uri, display: FontDisplay.SWAP }]),
    );
    loadAsync(fonts).catch(() => undefined);
  }
  return true;
}
