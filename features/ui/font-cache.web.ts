import { afterLoadWhenIdle } from './after-load-idle';

/**
 * Web: each pre-rendered page carries its @font-face rules switched off, and the server sends the
 * page's twin with them on when the request carries FONTS_COOKIE (server/dev/route-chunks.mjs, step 5;
 * server/web/serve-export.ts). This fetches the files once the first visit has loaded and is idle, into
 * the browser's cache, and then sets the cookie: the next visit draws its first paint in Source Sans 3
 * from the cache, while this one stays in the system face from start to end (no text moves mid-visit).
 */

/** The same name as FONTS_COOKIE in server/dev/route-chunks.mjs (a test holds them together). */
export const FONTS_COOKIE = 'squadline_fonts';
const FONT_STYLE_ID = 'expo-generated-fonts';
const YEAR_SECONDS = 365 * 24 * 60 * 60;

/** The font files the page's rules name. */
export function fontUrlsOf(css: string): string[] {
  return [...css.matchAll(/url\(\s*["']?([^"')]+)["']?\s*\)/g)].map((m) => m[1]!);
}

async function fetchFonts(): Promise<void> {
  const rules = document.getElementById(FONT_STYLE_ID) as HTMLStyleElement | null;
  // Rules on: the server saw the cookie, the browser has the files. No rules: nothing to fetch.
  if (!rules || rules.media !== 'not all') return;
  const urls = fontUrlsOf(rules.textContent ?? '');
  if (!urls.length) return;
  try {
    const answers = await Promise.all(urls.map((url) => fetch(url, { priority: 'low' } as RequestInit)));
    if (!answers.every((res) => res.ok)) return;
    const secure = location.protocol === 'https:' ? '; Secure' : '';
    document.cookie = `${FONTS_COOKIE}=1; Path=/; Max-Age=${YEAR_SECONDS}; SameSite=Lax${secure}`;
  } catch {
    // offline or refused: tried again on the next visit
  }
}

/** Once the page has loaded and the main thread is idle (never during the first screen's start-up). */
export function keepFontsForNextVisit(): void {
  afterLoadWhenIdle(() => void fetchFonts());
}
