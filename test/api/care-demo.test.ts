import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@/server/dev/seed/demo-accounts';
import { makeTestApp, signedInAgent } from '../fixtures/builders';
import { createTestDb, type TestDb } from '../fixtures/test-db';

let testDb: TestDb;
let app: ReturnType<typeof makeTestApp>['app'];

beforeAll(async () => {
  testDb = await createTestDb();
  const root = path.resolve(__dirname, '..', '..');
  const run = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/dev/db-cli.ts', 'reset'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: testDb.url },
    encoding: 'utf8',
  });
  if (run.status !== 0) throw new Error(`server/dev/db-cli.ts reset failed: ${run.stderr}`);
  ({ app } = makeTestApp(testDb.db));
}, 90_000);

afterAll(async () => {
  await testDb.drop();
});

describe('the demo care team', () => {
  it('gives the demo physiotherapist the newest round to review', async () => {
    const physio = await signedInAgent(app, 'physio@squadline.test', DEMO_PASSWORD);
    const res = await physio.get('/api/reviews');
    expect(res.status).toBe(200);
    expect(res.body.reviews.length).toBeGreaterThan(5);
    expect(new Set(res.body.reviews.map((r: { lastName: string }) => r.lastName))).not.toContain('Okafor');
  });

  it('gives the demo parent a released summary for Maya and Theo, with earlier ones', async () => {
    const parent = await signedInAgent(app, 'parent@squadline.test', DEMO_PASSWORD);
    const children = (await parent.get('/api/athletes')).body.athletes as { id: string; firstName: string }[];
    expect(children.map((c) => c.firstName).sort()).toEqual(['Maya', 'Theo']);
    for (const child of children) {
      const view = await parent.get(`/api/athletes/${child.id}/summary`);
      expect(view.status).toBe(200);
      expect(view.body.latest.summary.athleteFirstName).toBe(child.firstName);
      expect(view.body.earlier.length).toBeGreaterThan(0);
    }
  });
});
