import { afterLoadWhenIdle } from './after-load-idle';

/**
 * Web: each pre-rendered page carries its @font-face rules switched off, and turns them on only when
 * this browser has fetched the font files before (server/dev/route-chunks.mjs, step 5). This fetches
 * them once the first visit has loaded and is idle, into the browser's cache, and then leaves the mark:
 * the next visit draws its first paint in Source Sans 3 from the cache, while this one stays in the
 * system face from start to end (no text moves mid-visit).
 */

/** The same name as FONTS_MARK in server/dev/route-chunks.mjs (a test holds them together). */
export const FONTS_MARK = 'squadline.fonts';
const FONT_STYLE_ID = 'expo-generated-fonts';

/** The font files the page's rules name. */
export function fontUrlsOf(css: string): string[] {
  return [...css.matchAll(/url\(\s*["']?([^"')]+)["']?\s*\)/g)].map((m) => m[1]!);
}

async function fetchFonts(): Promise<void> {
  let marked: string | null = null;
  try {
    marked = localStorage.getItem(FONTS_MARK);
  } catch {
    return; // storage refused: the rules could never be switched on
  }
  if (marked === '1') return;
  const urls = fontUrlsOf(document.getElementById(FONT_STYLE_ID)?.textContent ?? '');
  if (!urls.length) return;
  try {
    const answers = await Promise.all(urls.map((url) => fetch(url, { priority: 'low' } as RequestInit)));
    if (answers.every((res) => res.ok)) localStorage.setItem(FONTS_MARK, '1');
  } catch {
    // offline or refused: tried again on the next visit
  }
}

/** Once the page has loaded and the main thread is idle (never during the first screen's start-up). */
export function keepFontsForNextVisit(): void {
  afterLoadWhenIdle(() => void fetchFonts());
}
