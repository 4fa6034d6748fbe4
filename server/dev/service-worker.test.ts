import { describe, expect, it } from 'vitest';
import { routeTable } from './service-worker.mjs';

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
