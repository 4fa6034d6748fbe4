import { type Locator, type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { FIGURE, figureJpeg, type Mark } from './figure';
import { signIn } from './helpers';

// The desk: a head coach places the points of photos a tester took courtside without them. Placing
// every point of one photo and moving on is counted (a click on the photo, a key or a button); the
// issue's target is at most 12 actions at 1440x900. The phone project runs the same flow with taps.

test.use({ actionTimeout: 30_000 });

/** Our choice: the target of the issue, not a published figure. */
const DESK_ACTION_BUDGET = 12;

/** A round of the under-13 squad with one athlete screened courtside: ticks, two photos, no points, submitted. */
async function courtsideScreen(page: Page, label: string) {
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-13 mixed')!;
  const created = await page.request.post('/api/rounds', { data: { squadId: squad.id, name: `Desk ${label} ${Date.now()}`, screenedOn: '2026-09-14' } });
  expect(created.status()).toBe(201);
  const round = (await created.json()) as { round: { id: string }; athletes: { assessmentId: string; photoConsent: boolean }[] };
  const a = round.athletes.find((x) => x.photoConsent)!;
  const photo = await figureJpeg();
  for (const view of ['front', 'side']) {
    const res = await page.request.post(`/api/assessments/${a.assessmentId}/photos`, {
      multipart: { task: 'two-leg-squat', view, photo: { name: `${view}.jpg`, mimeType: 'image/jpeg', buffer: photo } },
    });
    expect(res.status()).toBe(201);
  }
  const current = await (await page.request.get(`/api/assessments/${a.assessmentId}`)).json();
  const saved = await page.request.put(`/api/assessments/${a.assessmentId}`, {
    data: { draftVersion: current.draftVersion, draft: { body: {}, tasks: { 'two-leg-squat': { criteria: ['squat-right-knee-in'] } } } },
  });
  expect(saved.ok()).toBe(true);
  expect((await page.request.post(`/api/assessments/${a.assessmentId}/submit`)).ok()).toBe(true);
  return { roundId: round.round.id, assessmentId: a.assessmentId };
}

async function clickAt(surface: Locator, [fx, fy]: readonly [number, number]) {
  const box = (await surface.boundingBox())!;
  await surface.click({ position: { x: fx * box.width, y: fy * box.height } });
}

test("a coach places one photo's points at the desk in at most 12 actions, and the result is worked out again", async ({ page }, testInfo) => {
  test.setTimeout(180_000);
  const wide = testInfo.project.name === 'wide';
  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  const { roundId, assessmentId } = await courtsideScreen(page, testInfo.project.name);

  await page.goto(`/measuring?roundId=${roundId}`);
  await expect(page.getByRole('heading', { name: 'To measure' })).toBeVisible();
  await expect(page.getByTestId('measure-count')).toContainText('2 photos are waiting for their points in this round');
  await expect(page.getByTestId('measure-current')).toContainText('Two-leg full squat, front photo');
  await expect(page.getByTestId('measure-position')).toHaveText('Photo 1 of 2');
  const surface = page.getByTestId('landmark-surface');
  await expect(surface).toBeVisible();
  if (wide) {
    // The list names the round its photos come from (the queue may span rounds and squads).
    await expect(page.getByTestId('measure-list')).toBeVisible();
    await expect(page.getByTestId(`measure-round-${roundId}`)).toContainText(/Desk wide \d+ · Under-13 mixed · .*2026/);
  }

  // The counted part: every point of the front photo, then save and move on.
  let actions = 0;
  for (const mark of Object.keys(FIGURE) as Mark[]) {
    await clickAt(surface, FIGURE[mark]);
    actions += 1;
  }
  await expect(page.getByTestId('landmark-next')).toContainText('All 10 points placed');
  // Live angles beside the photo while placing.
  await expect(page.getByTestId('live-angles')).toContainText('Right knee angle from the front (FPPA)');
  await expect(page.getByTestId('live-angles')).toContainText('(valgus)');
  await page.screenshot({ path: testInfo.outputPath('desk-front-placed.png') });
  if (wide) await page.keyboard.press('Enter');
  else await page.getByTestId('measure-save-next').click();
  actions += 1;
  await expect(page.getByTestId('measure-saved')).toContainText('worked out again (version 2)');
  await expect(page.getByTestId('measure-current')).toContainText('Two-leg full squat, side photo');
  console.log(`[${testInfo.project.name}] desk: ${actions} actions to place one photo's points and move on`);
  expect(actions).toBeLessThanOrEqual(DESK_ACTION_BUDGET);

  // The result now carries the angles from the photo, as a new version beside the courtside one.
  const detail = await (await page.request.get(`/api/assessments/${assessmentId}`)).json();
  expect(detail.status).toBe('submitted');
  expect(detail.result.version).toBe(2);
  expect(detail.result.history.map((h: { version: number }) => h.version)).toEqual([1]);
  const fppa = detail.result.result.measurements.find((m: { id: string }) => m.id === 'two-leg-squat/fppa/right');
  expect(fppa.value).toBeGreaterThan(0);

  if (wide) {
    // The keyboard on the next photo: a point, Z undoes it, N picks the next point, 2 zooms.
    await expect(page.getByTestId('editor-shortcuts')).toContainText('N next point');
    await expect(page.getByTestId('landmark-next')).toContainText('Tap 1 of 4');
    await clickAt(surface, [0.5, 0.3]);
    await expect(page.getByTestId('landmark-next')).toContainText('Tap 2 of 4');
    await page.keyboard.press('z');
    await expect(page.getByTestId('landmark-next')).toContainText('Tap 1 of 4');
    await page.keyboard.press('n');
    await expect(page.getByTestId('landmark-next')).toContainText('Place again:');
    await page.keyboard.press('2');
    await expect(page.getByTestId('zoom-2')).toHaveAttribute('aria-checked', 'true');
  }
  await page.screenshot({ path: testInfo.outputPath('desk-side.png') });

  // Past the last photo: the end of the list is said, with a way round again (Skip had done nothing).
  await page.getByTestId('measure-skip').click();
  await expect(page.getByTestId('measure-round-done')).toContainText('You have been through every photo. 1 still waits');
  await page.getByTestId('measure-again').click();
  await expect(page.getByTestId('measure-current')).toContainText('Two-leg full squat, side photo');
});
