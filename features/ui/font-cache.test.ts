import { afterEach, describe, expect, it, vi } from 'vitest';
import { FONTS_MARK as MARK_IN_PAGES } from '../../server/dev/route-chunks.mjs';
import { FONTS_MARK, fontUrlsOf, keepFontsForNextVisit } from './font-cache.web';

const CSS =
  '@font-face{font-family:"SquadlineSans_400Regular";src:url("/assets/fonts/SquadlineSans-Regular.46b6.ttf");font-display:optional}' +
  '@font-face{font-family:"SquadlineSans_700Bold";src:url(/assets/fonts/SquadlineSans-Bold.440b.ttf);font-display:optional}';

// A stand-in for the browser: storage, the page's font rules, fetch, and the idle callback.
function page({ mark = null as string | null, css = CSS, status = 200, storage = true } = {}) {
  const store = new Map<string, string>(mark === null ? [] : [[FONTS_MARK, mark]]);
  const fetched: string[] = [];
  const idle: (() => void)[] = [];
  vi.stubGlobal('window', { addEventListener: () => undefined });
  vi.stubGlobal('document', { readyState: 'complete', getElementById: (id: string) => (id === 'expo-generated-fonts' ? { textContent: css } : null) });
  vi.stubGlobal('localStorage', {
    getItem: (k: string) => {
      if (!storage) throw new Error('refused');
      return store.get(k) ?? null;
    },
    setItem: (k: string, v: string) => store.set(k, v),
  });
  vi.stubGlobal('fetch', async (url: string) => {
    fetched.push(url);
    return { ok: status === 200 };
  });
  vi.stubGlobal('requestIdleCallback', (fn: () => void) => idle.push(fn));
  return { store, fetched, idle };
}
const settle = () => new Promise((r) => setTimeout(r, 0));

afterEach(() => vi.unstubAllGlobals());

describe('fonts kept for the next visit', () => {
  it('uses the same mark as the pages (server/dev/route-chunks.mjs)', () => {
    expect(FONTS_MARK).toBe(MARK_IN_PAGES);
  });

  it('reads the files the rules name, quoted or not', () => {
    expect(fontUrlsOf(CSS)).toEqual(['/assets/fonts/SquadlineSans-Regular.46b6.ttf', '/assets/fonts/SquadlineSans-Bold.440b.ttf']);
    expect(fontUrlsOf('')).toEqual([]);
  });

  it('fetches nothing until the page is idle, then both files, then leaves the mark', async () => {
    const p = page();
    keepFontsForNextVisit();
    expect(p.fetched).toEqual([]);
    p.idle.forEach((f) => f());
    await settle();
    expect(p.fetched).toEqual(fontUrlsOf(CSS));
    expect(p.store.get(FONTS_MARK)).toBe('1');
  });

  it('leaves no mark when a file did not come, and fetches nothing once marked', async () => {
    const failed = page({ status: 404 });
    keepFontsForNextVisit();
    failed.idle.forEach((f) => f());
    await settle();
    expect(failed.fetched).toHaveLength(2);
    expect(failed.store.has(FONTS_MARK)).toBe(false);

    const marked = page({ mark: '1' });
    keepFontsForNextVisit();
    marked.idle.forEach((f) => f());
    await settle();
    expect(marked.fetched).toEqual([]);
  });

  it('fetches nothing when storage is refused (the rules could never be switched on)', async () => {
    const p = page({ storage: false });
    keepFontsForNextVisit();
    p.idle.forEach((f) => f());
    await settle();
    expect(p.fetched).toEqual([]);
  });
});
