import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POSE_MODEL_BASE } from '@/features/pose-suggestion/model-files';
import { makeTestApp } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let webDir: string;

beforeAll(async () => {
  testDb = await createTestDb();
  // Inside a dot-folder on purpose: exports built by parallel test runs live under .tmp/.
  webDir = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'web-')), '.tmp', 'dist');
  fs.mkdirSync(path.join(webDir, '_expo', 'static', 'js'), { recursive: true });
  fs.writeFileSync(path.join(webDir, 'index.html'), '<html><body><div id="root"></div></body></html>');
  fs.writeFileSync(path.join(webDir, '_expo', 'static', 'js', 'entry-abc.js'), 'console.log("squadline");\n'.repeat(2000));
});

afterAll(async () => {
  await testDb.drop();
});

describe('serving the web export', () => {
  it('answers deep links with index.html, never cached', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir } });
    const res = await supertest(app).get('/screening/rounds/123');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<div id="root">');
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('compresses scripts and marks hashed bundles immutable', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir } });
    const res = await supertest(app).get('/_expo/static/js/entry-abc.js').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toMatch(/immutable/);
  });

  it('keeps unknown API routes as JSON 404s, not the web page', async () => {
    const { app } = makeTestApp(testDb.db, { config: { webDir } });
    const res = await supertest(app).get('/api/nothing-here');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
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
    const scriptSrc = csp.split(';').find((d) => d.trim().startsWith('script-src '))!.trim();
    expect(scriptSrc).toBe("script-src 'self' 'wasm-unsafe-eval'");
    expect(csp).not.toContain("'unsafe-eval'");
  });
});
