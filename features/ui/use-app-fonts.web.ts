import type * as ExpoFont from 'expo-font';
import { useEffect } from 'react';
import { keepFontsForNextVisit } from './font-cache';
// Imported here, not in the pre-rendering branch: the export copies only the files the browser's bundle
// references, and the pages' @font-face rules point at these.
import { FONT_SOURCES } from './font-sources';

/**
 * Web: never waits for the fonts. While pages are pre-rendered (Node, no `window`), every page registers
 * them, so its HTML carries the @font-face rules (Expo's preload links are taken out after the export:
 * server/dev/service-worker.mjs). After the export those rules are switched off until this browser has
 * fetched the files once (server/dev/route-chunks.mjs, step 5; the files are fetched when the first
 * visit is idle: font-cache.web.ts). `font-display: optional` still uses the face only if it is there
 * within the first moment of the page, and otherwise keeps the system face for that visit: text never
 * jumps when a font arrives late on a slow hall connection.
 *
 * The browser needs nothing more: the rules are in the page's head and stay there as the app moves
 * between screens. So expo-font (with expo-asset and a font observer, about 8 KB gzip that every page
 * evaluated) is required only in the pre-rendering bundle: Expo replaces `process.env.EXPO_SERVER` with
 * `false` in the browser's bundle, and the build drops the branch and its `require` with it.
 */
export function useAppFonts(): boolean {
  useEffect(keepFontsForNextVisit, []);
  // Each page's render registers them again: the pre-rendering collects them per page.
  if (process.env.EXPO_SERVER) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- a static import would put expo-font in every page's JavaScript
    const { FontDisplay, loadAsync } = require('expo-font') as typeof ExpoFont;
    const fonts: Record<string, ExpoFont.FontSource> = {};
    for (const [name, uri] of Object.entries(FONT_SOURCES)) fonts[name] = { uri, display: FontDisplay.OPTIONAL };
    loadAsync(fonts).catch(() => undefined);
  }
  return true;
}
