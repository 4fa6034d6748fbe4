import { expect, test, type Locator, type Page } from '@playwright/test';
import { FIGURE, figureJpeg, type Mark } from './figure';
import { openNav, signIn } from './helpers';

// A whole screening as the demo tester: open a round, screen an athlete with photo consent through every
// task, upload a front photo, place landmarks by clicking, see the live angle, submit, see the flags and
// the plan, then reload and find it all still there. Runs on the phone and the wide project; each run
// opens its own round so the two never screen the same athlete.

// A stuck step fails in half a minute rather than at the end of the whole test's time.
test.use({ actionTimeout: 30_000 });

/** Clicks a point of the photo; Playwright scrolls it into view and checks nothing covers it. */
async function clickAt(surface: Locator, [fx, fy]: readonly [number, number]) {
  const box = (await surface.boundingBox())!;
  await surface.click({ position: { x: fx * box.width, y: fy * box.height } });
}

async function expectSaved(page: Page) {
  await expect(page.getByTestId('save-status')).toHaveText('✓ Saved');
}

async function next(page: Page, counter: string | RegExp) {
  await page.getByTestId('step-next').click();
  await expect(page.getByTestId('step-counter')).toHaveText(counter);
}

test('a tester screens an athlete from a new round to the result, and it all survives a reload', async ({ page }, testInfo) => {
  test.setTimeout(240_000);
  const photo = await figureJpeg();
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  await expect(page.getByTestId('open-rounds')).toContainText('Continue screening');

  // Open a round for the under-13 squad (the roster test adds its athletes elsewhere, so the counts hold).
  await openNav(page);
  await page.getByRole('link', { name: 'Screening', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Screening' })).toBeVisible();
  const roundName = `E2E ${testInfo.project.name} ${Date.now()}`;
  // A phone keeps the form behind one button; a wide screen shows it beside the rounds.
  const start = page.getByTestId('open-round-start');
  if (await start.isVisible()) await start.click();
  await page.getByTestId('open-round-submit').click();
  await expect(page.getByText('Name the round.')).toBeVisible();
  await page.getByRole('radio', { name: /Under-13 mixed/ }).click();
  await page.getByTestId('round-name').fill(roundName);
  // The date is the browser's date input (a picker on a phone), today by default.
  await expect(page.getByTestId('round-date')).toHaveAttribute('type', 'date');
  await expect(page.getByTestId('round-date')).toHaveValue(/^\d{4}-\d{2}-\d{2}$/);
  await page.screenshot({ path: testInfo.outputPath('open-round-form.png') });
  await page.getByTestId('open-round-submit').click();
  await expect(page.getByRole('heading', { name: roundName })).toBeVisible();
  await expect(page.getByText('0 of 12 submitted')).toBeVisible();
  await expect(page.getByText('No photo consent')).toHaveCount(1);

  // An athlete without photo consent: said at the top and on the task, and no photo control.
  await page.locator('[data-testid^="round-athlete-"]').filter({ hasText: 'No photo consent' }).click();
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');
  await page.getByTestId('step-next').click();
  await expect(page.getByTestId('photos-no-consent')).toContainText('no photo is taken');
  await expect(page.getByTestId('photo-front-library')).toHaveCount(0);
  await page.getByRole('link', { name: `← ${roundName}` }).click();

  // The first athlete with photo consent.
  const row = page.locator('[data-testid^="round-athlete-"]').filter({ hasNotText: 'No photo consent' }).first();
  const athleteName = (await row.getByText(/\S+ \S+/).first().innerText()).trim();
  const athleteId = (await row.getAttribute('data-testid'))!.replace('round-athlete-', '');
  await row.click();
  await expect(page.getByTestId('capture-athlete')).toHaveText(athleteName);
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');

  // Body measurements, with an error beside the field for a slip of the finger.
  await page.getByTestId('body-stature').fill('1520');
  await expect(page.getByText('Standing height (cm) must be at most 220.')).toBeVisible();
  await page.getByTestId('body-stature').fill('152');
  await page.getByTestId('body-sitting').fill('79,5');
  await page.getByTestId('body-mass').fill('41');
  await expectSaved(page);

  // The connection drops: the draft says so, keeps retrying, and gets through when it is back.
  const assessmentId = new URL(page.url()).pathname.split('/').pop()!;
  await page.route('**/api/assessments/*', (route) => (route.request().method() === 'PUT' ? route.abort() : route.continue()));
  await page.getByTestId('body-mass').fill('41.5');
  await expect(page.getByTestId('save-status')).toHaveText('Not saved — retrying');
  await page.unroute('**/api/assessments/*');
  await expectSaved(page);

  // Another phone saves first: this phone's edit and the other phone's are both kept.
  const current = await (await page.request.get(`/api/assessments/${assessmentId}`)).json();
  const other = await page.request.put(`/api/assessments/${assessmentId}`, {
    data: { draftVersion: current.draftVersion, draft: { ...current.draft, body: { ...current.draft.body, massKg: 43 } } },
  });
  expect(other.ok()).toBe(true);
  await page.getByTestId('body-sitting').fill('80');
  await expect(page.getByText('Merged with a newer save')).toBeVisible();
  await expectSaved(page);
  await expect(page.getByTestId('body-mass')).toHaveValue('43');
  await expect(page.getByTestId('body-sitting')).toHaveValue('80');

  // Task 1: the two-leg squat, with a front photo and its landmarks.
  await next(page, 'Task 1 of 9');
  await expect(page.getByTestId('task-safety')).toContainText('Stop at once if the athlete reports pain');
  await page.getByTestId('criterion-squat-right-knee-in').click();
  await expect(page.getByTestId('criterion-squat-right-knee-in')).toHaveAttribute('aria-checked', 'true');
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('photo-front-library').click()]);
  await chooser.setFiles({ name: 'front.jpg', mimeType: 'image/jpeg', buffer: photo });
  await expect(page.getByTestId('photo-front-landmarks')).toBeVisible({ timeout: 30_000 });
  await page.getByTestId('photo-front-landmarks').click();
  const surface = page.getByTestId('landmark-surface');
  await expect(surface).toBeVisible();
  await expect(page.getByTestId('landmark-next')).toContainText('Right hip centre');
  for (const mark of Object.keys(FIGURE) as Mark[]) await clickAt(surface, FIGURE[mark]);
  await expect(page.getByTestId('landmark-next')).toContainText('All 10 points placed');
  // The live angle: the right knee drawn towards the midline reads as valgus.
  const angles = page.getByTestId('live-angles');
  await expect(angles).toContainText('Right knee angle from the front (FPPA)');
  await expect(angles).toContainText('(valgus)');
  await expect(surface.locator('text').filter({ hasText: /^R \d+°$/ })).toHaveCount(1);
  await expect(angles).toContainText('0.0° from vertical');
  // Drag the middle of the hips sideways: the trunk lean follows live; undo puts it back.
  const box = (await surface.boundingBox())!;
  const [hx, hy] = FIGURE['mid-hip'];
  await page.mouse.move(box.x + hx * box.width, box.y + hy * box.height);
  await page.mouse.down();
  await page.mouse.move(box.x + hx * box.width + 30, box.y + hy * box.height, { steps: 6 });
  await page.mouse.up();
  await expect(angles).not.toContainText('0.0° from vertical');
  await page.getByTestId('landmarks-undo').click();
  await expect(angles).toContainText('0.0° from vertical');
  // Zoom for precision, and pick a point in the list to place it again.
  await page.getByTestId('zoom-3').click();
  await expect(page.getByTestId('zoom-3')).toHaveAttribute('aria-checked', 'true');
  await page.getByTestId('zoom-1').click();
  await page.getByTestId('landmark-item-mid-hip').click();
  await expect(page.getByTestId('landmark-next')).toContainText('Place again: Middle of the hips');
  await clickAt(surface, FIGURE['mid-hip']);
  await page.getByTestId('landmarks-done').click();
  await expect(page.getByTestId('photo-front-placed')).toHaveText('10 of 10 landmarks placed.');
  await expectSaved(page);

  // A reload mid-screen loses nothing: same step, same ticks, same measurements.
  await page.reload();
  await expect(page.getByTestId('step-counter')).toHaveText('Task 1 of 9');
  await expect(page.getByTestId('criterion-squat-right-knee-in')).toHaveAttribute('aria-checked', 'true');
  await expect(page.getByTestId('photo-front-placed')).toHaveText('10 of 10 landmarks placed.');

  // The other tasks, in order.
  await next(page, 'Task 2 of 9');
  await page.getByTestId('criterion-sls-knee-in').click();
  await page.getByTestId('task-notes').fill('Knee drifts in from the third rep.');
  await next(page, 'Task 3 of 9');
  await next(page, 'Task 4 of 9');
  await expect(page.getByTestId('task-safety')).toContainText('spotter');
  await expect(page.getByTestId('task-safety')).toContainText('20-30 cm');
  await next(page, 'Task 5 of 9');
  await next(page, 'Task 6 of 9');
  await next(page, 'Task 7 of 9');
  await page.getByTestId('task-distance').fill('7');
  await next(page, 'Task 8 of 9');
  await page.getByTestId('task-distance').fill('11');
  await next(page, 'Task 9 of 9');
  await page.getByTestId('task-skip').click();
  await page.getByTestId('task-skip-reason').fill('Ran out of time on court 3.');
  await next(page, 'All 9 tasks');
  await expect(page.getByTestId('review-racket-side-lunge')).toContainText('Skipped: Ran out of time on court 3.');

  // Submit: flags in plain words, the plan with its prescriptions.
  await page.getByTestId('submit-assessment').click();
  await expect(page).toHaveURL(/\/result$/);
  const checkResult = async () => {
    await expect(page.getByTestId('flags')).toContainText(/Concern|Watch/);
    await expect(page.getByTestId('flags')).toContainText('Right side');
    await expect(page.getByTestId('flags')).toContainText('Source:');
    await expect(page.locator('[data-testid^="exercise-"]').first()).toBeVisible();
    await expect(page.getByTestId('plan')).toContainText(/sets ×/);
    await expect(page.getByTestId('plan-cautions')).toContainText('not a diagnosis');
    await expect(page.getByTestId('plan-rescreen')).toContainText('weeks');
    await expect(page.getByTestId('result-photo-two-leg-squat-front')).toContainText('FPPA');
  };
  await checkResult();

  // The tester adjusts the plan: drop the first exercise, save; the adjustment is shown as theirs.
  await page.getByTestId('plan-adjust').click();
  await page.locator('[data-testid^="drop-"]').first().click();
  await page.getByTestId('plan-note').fill('Short session this week.');
  await page.getByTestId('plan-save').click();
  await expect(page.getByTestId('plan-source')).toContainText('Adjusted by');

  // Reload: everything is still there.
  await page.reload();
  await checkResult();
  await expect(page.getByTestId('plan-source')).toContainText('Adjusted by');
  await expect(page.getByTestId('plan-source')).toContainText('Short session this week.');

  // The round counts the submission; the athlete's page lists it with its flags.
  await page.getByRole('link', { name: `← ${roundName}` }).click();
  await expect(page.getByText('1 of 12 submitted')).toBeVisible();
  const submitted = page.locator('[data-testid^="round-athlete-"]').filter({ hasText: athleteName });
  await expect(submitted).toContainText('Submitted');

  // The athlete's page lists the screening with its flags, newest first (before the demo history).
  await page.goto(`/athletes/${athleteId}`);
  const history = page.getByTestId('athlete-assessments');
  const ours = history.locator('[data-testid^="athlete-assessment-"]').filter({ hasText: roundName });
  await expect(ours).toContainText('Submitted');
  await expect(ours).toContainText(/Watch|Concern/);
  await expect(history).toContainText('Autumn check');
  const items = await history.locator('[data-testid^="athlete-assessment-"]').allInnerTexts();
  expect(items.findIndex((t) => t.includes(roundName))).toBeLessThan(items.findIndex((t) => t.includes('Autumn check')));
});
