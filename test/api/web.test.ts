import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POSE_MODEL_BASE } from '@/features/pose-suggestion/model-files';
import { makeTestApp } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let staticDir: string;
let singleDir: string;

const HYDRATE = 'globalThis.__EXPO_ROUTER_HYDRATE__=true;';
const page = (text: string) =>
  `<!DOCTYPE html><html><head><script type="module">${HYDRATE}</script></head><body><div id="root">${text}</div>` +
  '<script src="/_expo/static/js/web/entry-abc.js" defer></script></body></html>';

function write(dir: string, rel: string, content: string | Buffer) {
  fs.mkdirSync(path.dirname(path.join(dir, rel)), { recursive: true });
  fs.writeFileSync(path.join(dir, rel), content);
}

beforeAll(async () => {
  testDb = await createTestDb();
  // Inside a dot-folder on purpose: exports built by parallel test runs live under .tmp/.
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'web-'));
  staticDir = path.join(base, '.tmp', 'dist-static');
  const script = 'console.log("squadline");\n'.repeat(2000);
  // What `expo export` writes with web.output "static", plus the precompressed copies the build adds.
  write(staticDir, 'index.html', page('Home page'));
  write(staticDir, '(club)/index.html', page('Home page'));
  write(staticDir, 'sign-in.html', page('Sign-in page'));
  write(staticDir, 'athletes/index.html', page('Athlete list'));
  write(staticDir, 'athletes/[id].html', page('One athlete'));
  write(staticDir, 'screening/assessments/[id]/result.html', page('Result page'));
  write(staticDir, '+not-found.html', page('Page not found'));
  // The twins with web fonts on (server/dev/route-chunks.mjs, step 5), one page without one.
  write(staticDir, '_fonts/sign-in.html', page('Sign-in page, fonts on'));
  write(staticDir, '_fonts/+not-found.html', page('Page not found, fonts on'));
  write(staticDir, '_expo/static/js/web/entry-abc.js', script);
  write(staticDir, '_expo/static/js/web/entry-abc.js.br', zlib.brotliCompressSync(script));
  write(staticDir, '_expo/static/js/web/entry-abc.js.gz', zlib.gzipSync(script));
  write(staticDir, '_expo/static/js/web/route-def.js', script);
  // A single-page export: one index.html for every path.
  singleDir = path.join(base, '.tmp', 'dist-single');
  write(singleDir, 'index.html', '<html><body><div id="root"></div></body></html>');
});

afterAll(async () => {
  await testDb.drop();
});

describe('serving a static web export', () => {
  it.each([
    ['/sign-in', 'Sign-in page'],
    ['/', 'Home page'],
    ['/athletes', 'Athlete list'],
    ['/athletes/3f1c9a', 'One athlete'],
    ['/screening/assessments/77/result', 'Result page'],
  ])('answers %s with its pre-rendered page, revalidated on every visit', async (url, text) => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app).get(url);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain(text);
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it("sends a page's twin with web fonts on only to a browser whose cookie says it has the files", async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const plain = await supertest(app).get('/sign-in');
    expect(plain.text).toContain('Sign-in page');
    expect(plain.text).not.toContain('fonts on');
    expect(plain.headers.vary).toBe('Accept-Encoding, Cookie');
    const twin = await supertest(app).get('/sign-in').set('Cookie', 'squadline_session=abc; squadline_fonts=1');
    expect(twin.text).toContain('Sign-in page, fonts on');
    expect((await supertest(app).get('/sign-in').set('Cookie', 'squadline_fonts=10')).text).not.toContain('fonts on');
    expect((await supertest(app).get('/sign-in').set('Cookie', 'xsquadline_fonts=1')).text).not.toContain('fonts on');
    const missing = await supertest(app).get('/athletes').set('Cookie', 'squadline_fonts=1');
    expect(missing.text).toContain('Athlete list');
    const notFound = await supertest(app).get('/no/such/page').set('Cookie', 'squadline_fonts=1');
    expect([notFound.status, notFound.text.includes('Page not found, fonts on')]).toEqual([404, true]);
    // The twins are no pages of their own address.
    expect((await supertest(app).get('/_fonts/sign-in')).text).not.toContain('fonts on');
  });

  it('answers an unknown path with the not-found page and a 404', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app).get('/no/such/page');
    expect(res.status).toBe(404);
    expect(res.text).toContain('Page not found');
  });

  it('lets the hydration script through the content security policy, and no other inline script', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app).get('/sign-in');
    const csp = String(res.headers['content-security-policy']);
    const scriptSrc = csp.split(';').find((d) => d.trim().startsWith('script-src'))!;
    const sha = (await import('node:crypto')).createHash('sha256').update(HYDRATE).digest('base64');
    expect(scriptSrc).toContain(`'sha256-${sha}'`);
    expect(scriptSrc).not.toContain('unsafe-inline');
  });

  it('sends the Brotli copy of a hashed bundle, marked immutable', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app)
      .get('/_expo/static/js/web/entry-abc.js')
      .set('Accept-Encoding', 'br, gzip')
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toMatch(/immutable/);
    expect(res.headers['cache-control']).toMatch(/max-age=31536000/);
    // supertest decodes the Brotli body on the way in.
    expect((res.body as Buffer).toString()).toContain('squadline');
  });

  it('falls back to the gzip copy, and compresses bundles that have no copy on the fly', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const gz = await supertest(app).get('/_expo/static/js/web/entry-abc.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toContain('squadline');
    const live = await supertest(app).get('/_expo/static/js/web/route-def.js').set('Accept-Encoding', 'gzip');
    expect(live.headers['content-encoding']).toBe('gzip');
    expect(live.headers['cache-control']).toMatch(/immutable/);
  });

  it('answers a missing bundle with a plain 404, not a page', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app).get('/_expo/static/js/web/gone-123.js');
    expect(res.status).toBe(404);
    expect(res.text).not.toContain('<html');
  });

  it('keeps unknown API routes as JSON errors, not the web page', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: staticDir } });
    const res = await supertest(app).get('/api/nothing-here');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('serving a single-page web export', () => {
  it('answers deep links with index.html, never cached', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir: singleDir } });
    const res = await supertest(app).get('/screening/rounds/123');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<div id="root">');
    expect(res.headers['cache-control']).toBe('no-cache');
  });
});

describe('serving the pose model for suggested points', () => {
  it('serves the runtime and the model files from our origin, cached for a year, and nothing else of the package', async () => {
    const { app } = makeTestApp(testDb.db);
    const script = await supertest(app).get(`${POSE_MODEL_BASE}/pose.js`);
    expect(script.status).toBe(200);
    expect(script.headers['content-type']).toMatch(/javascript/);
    expect(script.headers['cache-control']).toMatch(/immutable/);
    const wasm = await supertest(app).head(`${POSE_MODEL_BASE}/pose_solution_simd_wasm_bin.wasm`);
    expect(wasm.status).toBe(200);
    expect(wasm.headers['content-type']).toBe('application/wasm');
    expect((await supertest(app).head(`${POSE_MODEL_BASE}/pose_landmark_full.tflite`)).status).toBe(200);
    expect((await supertest(app).get(`${POSE_MODEL_BASE}/package.json`)).status).toBe(404);
    expect((await supertest(app).get(`${POSE_MODEL_BASE}/../package.json`)).status).toBe(404);
    expect((await supertest(app).get('/pose-model/0.0.1/pose.js')).status).toBe(404);
  });

  it('lets WebAssembly compile but allows no script eval and no other origin', async () => {
    const { app } = makeTestApp(testDb.db);
    const csp = (await supertest(app).get(`${POSE_MODEL_BASE}/pose.js`)).headers['content-security-policy'] as string;
    const scriptSrc = csp
      .split(';')
      .find((d) => d.trim().startsWith('script-src '))!
      .trim();
    expect(scriptSrc).toBe("script-src 'self' 'wasm-unsafe-eval'");
    expect(csp).not.toContain("'unsafe-eval'");
  });
});
