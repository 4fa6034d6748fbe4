import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { addRouteChunks, chunksFor, publicPageNames, withChunks } from './route-chunks.mjs';

const JS = '/_expo/static/js/web';
const tag = (name: string) => `<script src="${JS}/${name}" defer></script>`;
const page = (...names: string[]) => `<html><head></head><body><div id="root">x</div>${names.map(tag).join('')}</body></html>`;
const order = (html: string) => [...html.matchAll(/<script src="[^"]*\/([^"/]+)" defer>/g)].map((m) => m[1]);

describe('every page names the chunks its first render needs', () => {
  it('adds the missing ones before the entry chunk, in the order given, and keeps what is there', () => {
    const html = page('__expo-metro-runtime-1.js', '_layout-root.js', '_layout-public.js', 'sign-in-2.js', '__common-3.js', 'entry-4.js');
    const next = withChunks(html, [`${JS}/_layout-root.js`, `${JS}/_layout-public.js`, `${JS}/_layout-club.js`]);
    expect(order(next)).toEqual([
      '__expo-metro-runtime-1.js',
      '_layout-root.js',
      '_layout-public.js',
      'sign-in-2.js',
      '__common-3.js',
      '_layout-club.js',
      'entry-4.js',
    ]);
    expect(next.replace(tag('_layout-club.js'), '')).toBe(html);
  });

  it('leaves a page that names them all as it is, and running twice adds nothing more', () => {
    const html = page('_layout-a.js', 'entry-1.js');
    expect(withChunks(html, [`${JS}/_layout-a.js`])).toBe(html);
    const once = withChunks(html, [`${JS}/_layout-b.js`]);
    expect(withChunks(once, [`${JS}/_layout-b.js`])).toBe(once);
  });

  it('refuses a page with no entry chunk rather than writing tags nowhere', () => {
    expect(() => withChunks(page('_layout-a.js'), [`${JS}/_layout-b.js`])).toThrow(/entry/);
  });

  it('gives the signed-in shell to the signed-in pages and the device store to the screening pages', () => {
    const chunks = { layouts: ['L1', 'L2'], shell: ['S'], device: ['D'] };
    const open = ['sign-in', 'accept-invite'];
    expect(chunksFor('screening/rounds/[id].html', chunks, open)).toEqual(['L1', 'L2', 'S', 'D']);
    expect(chunksFor('(club)/screening/assessments/[id].html', chunks, open)).toEqual(['L1', 'L2', 'S', 'D']);
    expect(chunksFor('index.html', chunks, open)).toEqual(['L1', 'L2', 'S']);
    expect(chunksFor('trends.html', chunks, open)).toEqual(['L1', 'L2', 'S']);
    expect(chunksFor('sign-in.html', chunks, open)).toEqual(['L1', 'L2']);
    expect(chunksFor('(public)/accept-invite.html', chunks, open)).toEqual(['L1', 'L2']);
    expect(chunksFor('+not-found.html', chunks, open)).toEqual(['L1', 'L2']);
  });

  it("reads the signed-out pages from the app's folder", () => {
    expect(publicPageNames(path.resolve(__dirname, '../..'))).toEqual(
      expect.arrayContaining(['sign-in', 'forgot-password', 'reset-password', 'accept-invite']),
    );
    expect(publicPageNames(path.resolve(__dirname, '../..'))).not.toContain('_layout');
  });
});

describe('rewriting an export folder', () => {
  let dir = '';
  afterEach(() => dir && fs.rmSync(dir, { recursive: true, force: true }));

  it('refuses an export without the signed-in shell chunk (renamed or merged) rather than leaving it to load late', () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'route-chunks-'));
    const js = path.join(dir, '_expo/static/js/web');
    fs.mkdirSync(js, { recursive: true });
    for (const f of ['_layout-aa.js', 'device-cc.js', 'entry-dd.js']) fs.writeFileSync(path.join(js, f), '');
    expect(() => addRouteChunks(dir, dir)).toThrow(/club-shell/);
  });

  it('rewrites the pages, not the scripts, and names each chunk that exists', () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'route-chunks-'));
    const js = path.join(dir, '_expo/static/js/web');
    fs.mkdirSync(js, { recursive: true });
    for (const f of ['_layout-aa.js', '_layout-bb.js', 'club-shell-ff.js', 'device-cc.js', 'entry-dd.js', 'sign-in-ee.js'])
      fs.writeFileSync(path.join(js, f), '');
    fs.mkdirSync(path.join(dir, 'app/(public)'), { recursive: true });
    for (const f of ['_layout.tsx', 'sign-in.tsx']) fs.writeFileSync(path.join(dir, 'app/(public)', f), '');
    fs.mkdirSync(path.join(dir, 'screening/rounds'), { recursive: true });
    fs.writeFileSync(path.join(dir, 'sign-in.html'), page('_layout-aa.js', 'sign-in-ee.js', 'entry-dd.js'));
    fs.writeFileSync(path.join(dir, 'screening/rounds/[id].html'), page('_layout-aa.js', '_layout-bb.js', 'entry-dd.js'));
    expect(addRouteChunks(dir, dir)).toBe(2);
    expect(order(fs.readFileSync(path.join(dir, 'sign-in.html'), 'utf8'))).toEqual(['_layout-aa.js', 'sign-in-ee.js', '_layout-bb.js', 'entry-dd.js']);
    expect(order(fs.readFileSync(path.join(dir, 'screening/rounds/[id].html'), 'utf8'))).toEqual([
      '_layout-aa.js',
      '_layout-bb.js',
      'club-shell-ff.js',
      'device-cc.js',
      'entry-dd.js',
    ]);
    expect(addRouteChunks(dir, dir)).toBe(0);
  });
});
