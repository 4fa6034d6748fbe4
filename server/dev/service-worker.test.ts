import { describe, expect, it } from 'vitest';
import vm from 'node:vm';
import { linkManifestInto, routeTable } from './service-worker.mjs';

type Route = { pattern: string; file: string };
const fileFor = (routes: Route[], pathname: string) => routes.find((r) => new RegExp(r.pattern).test(pathname))?.file ?? '/index.html';

describe('the offline worker finds the page of a route', () => {
  it('single-page export: every route is the app shell', () => {
    const routes = routeTable(['index.html']) as Route[];
    expect(fileFor(routes, '/')).toBe('/index.html');
    expect(fileFor(routes, '/screening/rounds/2f1c')).toBe('/index.html');
  });

  it("static export: the route's own HTML, groups left out, static segments before dynamic ones", () => {
    const routes = routeTable([
      '(club)/index.html',
      '(club)/screening/index.html',
      '(club)/screening/rounds/[id].html',
      '(club)/screening/assessments/[id]/index.html',
      '(club)/screening/assessments/[id]/result.html',
      '(club)/athletes/[id].html',
      '(club)/athletes/import.html',
      '(public)/sign-in.html',
      '+not-found.html',
      '_sitemap.html',
    ]) as Route[];
    expect(fileFor(routes, '/')).toBe('/(club)/index.html');
    expect(fileFor(routes, '/sign-in')).toBe('/(public)/sign-in.html');
    expect(fileFor(routes, '/screening/rounds/2f1c-77')).toBe('/(club)/screening/rounds/[id].html');
    expect(fileFor(routes, '/screening/assessments/ab12')).toBe('/(club)/screening/assessments/[id]/index.html');
    expect(fileFor(routes, '/screening/assessments/ab12/result')).toBe('/(club)/screening/assessments/[id]/result.html');
    expect(fileFor(routes, '/athletes/import')).toBe('/(club)/athletes/import.html');
    expect(fileFor(routes, '/athletes/9d')).toBe('/(club)/athletes/[id].html');
    expect(fileFor(routes, '/nowhere/at/all')).toBe('/index.html');
  });
});

describe('each page links the manifest and its icon once it has been drawn', () => {
  const page =
    '<html><head><meta charset="utf-8"><link rel="preload" href="/assets/a.ttf" as="font" crossorigin=""></head><body><div id="root"></div></body></html>';

  it('the HTML itself fetches neither: a placeholder icon, the links in the start queue; no font preload', () => {
    const html = linkManifestInto(page);
    expect(html).not.toMatch(/<link rel="manifest"/);
    expect(html).toContain('<link rel="icon" href="data:,">');
    expect(html).toContain('<link rel="apple-touch-icon" href="/icons/icon-192.png">');
    expect(html).not.toContain('as="font"');
    expect(linkManifestInto(html)).toBe(html);
  });

  it('when the loader starts the app, the manifest is linked and the icon points at the file', () => {
    const html = linkManifestInto(page);
    const script = /<script>([\s\S]*?)<\/script>/.exec(html)![1]!;
    const appended: Record<string, string>[] = [];
    const icon: Record<string, string> = { rel: 'icon', href: 'data:,' };
    const window: { __squadlineOnStart?: (() => void)[] } = {};
    const document = {
      createElement: () => ({}) as Record<string, string>,
      head: { appendChild: (el: Record<string, string>) => appended.push(el) },
      querySelector: (sel: string) => (sel === 'link[rel="icon"]' ? icon : null),
    };
    vm.runInNewContext(script, { window, document });
    expect(appended).toEqual([]);
    expect(window.__squadlineOnStart).toHaveLength(1);
    window.__squadlineOnStart![0]!();
    expect(appended).toEqual([{ rel: 'manifest', href: '/manifest.webmanifest' }]);
    expect(icon).toEqual({ rel: 'icon', href: '/icons/icon-192.png', type: 'image/png' });
  });
});
