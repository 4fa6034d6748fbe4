import { afterEach, describe, expect, it, vi } from 'vitest';
import { FONTS_COOKIE as COOKIE_IN_PAGES } from '../../server/dev/route-chunks.mjs';
import { FONTS_COOKIE, fontUrlsOf, keepFontsForNextVisit } from './font-cache.web';

const CSS =
  '@font-face{font-family:"SquadlineSans_400Regular";src:url("/assets/fonts/SquadlineSans-Regular.46b6.ttf");font-display:optional}' +
  '@font-face{font-family:"SquadlineSans_700Bold";src:url(/assets/fonts/SquadlineSans-Bold.440b.ttf);font-display:optional}';

// A stand-in for the browser: the page's font rules (off, or on in the twin the server sends), its
// cookies as written, fetch, and the idle callback.
function page({ media = 'not all', css = CSS, status = 200, protocol = 'http:' } = {}) {
  const cookies: string[] = [];
  const fetched: string[] = [];
  const idle: (() => void)[] = [];
  vi.stubGlobal('window', { addEventListener: () => undefined });
  vi.stubGlobal('location', { protocol });
  vi.stubGlobal('document', {
    readyState: 'complete',
    getElementById: (id: string) => (id === 'expo-generated-fonts' ? { textContent: css, media } : null),
    set cookie(value: string) {
      cookies.push(value);
    },
  });
  vi.stubGlobal('fetch', async (url: string) => {
    fetched.push(url);
    return { ok: status === 200 };
  });
  vi.stubGlobal('requestIdleCallback', (fn: () => void) => idle.push(fn));
  return { cookies, fetched, idle };
}
const settle = () => new Promise((r) => setTimeout(r, 0));

afterEach(() => vi.unstubAllGlobals());

describe('fonts kept for the next visit', () => {
  it('sets the cookie the server reads (server/dev/route-chunks.mjs)', () => {
    expect(FONTS_COOKIE).toBe(COOKIE_IN_PAGES);
  });

  it('reads the files the rules name, quoted or not', () => {
    expect(fontUrlsOf(CSS)).toEqual(['/assets/fonts/SquadlineSans-Regular.46b6.ttf', '/assets/fonts/SquadlineSans-Bold.440b.ttf']);
    expect(fontUrlsOf('')).toEqual([]);
  });

  it('fetches nothing until the page is idle, then both files, then sets the cookie for a year', async () => {
    const p = page();
    keepFontsForNextVisit();
    expect(p.fetched).toEqual([]);
    p.idle.forEach((f) => f());
    await settle();
    expect(p.fetched).toEqual(fontUrlsOf(CSS));
    expect(p.cookies).toEqual(['squadline_fonts=1; Path=/; Max-Age=31536000; SameSite=Lax']);
  });

  it('marks the cookie Secure over HTTPS', async () => {
    const p = page({ protocol: 'https:' });
    keepFontsForNextVisit();
    p.idle.forEach((f) => f());
    await settle();
    expect(p.cookies).toEqual(['squadline_fonts=1; Path=/; Max-Age=31536000; SameSite=Lax; Secure']);
  });

  it('sets no cookie when a file did not come, and fetches nothing when the page came with the rules on', async () => {
    const failed = page({ status: 404 });
    keepFontsForNextVisit();
    failed.idle.forEach((f) => f());
    await settle();
    expect(failed.fetched).toHaveLength(2);
    expect(failed.cookies).toEqual([]);

    const on = page({ media: '' });
    keepFontsForNextVisit();
    on.idle.forEach((f) => f());
    await settle();
    expect(on.fetched).toEqual([]);
    expect(on.cookies).toEqual([]);
  });
});
