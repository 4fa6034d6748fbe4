import { describe, expect, it } from 'vitest';
import { buildPageTable, matchPage, routeOfFile } from './page-routes';

// The files `expo export` writes with `web.output: "static"` for a tree like Squadline's `app/`.
const STATIC_EXPORT = [
  'index.html',
  '(club)/index.html',
  'sign-in.html',
  '(public)/sign-in.html',
  'athletes/index.html',
  'athletes/new.html',
  'athletes/[id].html',
  '(club)/athletes/[id].html',
  'screening/rounds/[id].html',
  'screening/assessments/[id].html',
  'screening/assessments/[id]/result.html',
  'help/[...topic].html',
  'squads/[[...rest]].html',
  '+not-found.html',
  '_sitemap.html',
  '_expo/static/js/web/entry-abc.js',
  'assets/fonts/a.ttf',
];

describe('routeOfFile', () => {
  it('skips the group copies and special files Expo writes beside the pages', () => {
    expect(routeOfFile('(club)/athletes/[id].html')).toBeNull();
    expect(routeOfFile('+not-found.html')).toBeNull();
    expect(routeOfFile('_sitemap.html')).toBeNull();
    expect(routeOfFile('_expo/static/js/web/entry-abc.js')).toBeNull();
  });
});

describe('matchPage on a static export', () => {
  const table = buildPageTable(STATIC_EXPORT);
  it.each([
    ['/', 'index.html'],
    ['/sign-in', 'sign-in.html'],
    ['/sign-in/', 'sign-in.html'],
    ['/athletes', 'athletes/index.html'],
    ['/athletes/new', 'athletes/new.html'],
    ['/athletes/9b2f-41c0', 'athletes/[id].html'],
    ['/screening/rounds/42', 'screening/rounds/[id].html'],
    ['/screening/assessments/7', 'screening/assessments/[id].html'],
    ['/screening/assessments/7/result', 'screening/assessments/[id]/result.html'],
    ['/help/a/b/c', 'help/[...topic].html'],
    ['/squads', 'squads/[[...rest]].html'],
    ['/squads/x/y', 'squads/[[...rest]].html'],
  ])('%s is answered by %s', (url, file) => {
    expect(matchPage(table, url)).toEqual({ file, status: 200 });
  });

  it('prefers a static segment over a dynamic one (our choice, as Expo Router ranks routes)', () => {
    expect(matchPage(table, '/athletes/new')?.file).toBe('athletes/new.html');
  });

  it.each(['/nowhere', '/athletes/1/2', '/help', '/screening/assessments/7/other'])('%s gets the not-found page with a 404', (url) => {
    expect(matchPage(table, url)).toEqual({ file: '+not-found.html', status: 404 });
  });
});

describe('matchPage on a single-page export', () => {
  it('answers every path with index.html, leaving routing to the client', () => {
    const table = buildPageTable(['index.html', '_expo/static/js/web/entry-abc.js']);
    expect(matchPage(table, '/')).toEqual({ file: 'index.html', status: 200 });
    expect(matchPage(table, '/screening/rounds/123')).toEqual({ file: 'index.html', status: 200 });
  });
});
