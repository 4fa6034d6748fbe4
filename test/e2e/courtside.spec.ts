import { type FileChooser, type Locator, type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import sharp from 'sharp';
import { signIn } from './helpers';

// Courtside: one athlete screened with ticks, distances and every required photo, landmarks left for a
// desk. Every action of the tester is counted (a tap, a field typed into, a photo taken); the issue's
// target is at most 40 on a 390x844 phone. Runs on both projects; each run opens its own round.

test.use({ actionTimeout: 30_000 });

/** Our choice: the target of the issue, not a published figure. */
const COURTSIDE_ACTION_BUDGET = 40;

/** A plain generated picture (never a photo of a person): the capture does not look at its content. */
function plainJpeg(shade: number): Promise<Buffer> {
  return sharp({ create: { width: 900, height: 1200, channels: 3, background: { r: shade, g: 120, b: 140 } } })
    .jpeg({ quality: 70 })
    .toBuffer();
}

/** Counts what the tester does; reading the screen and waiting are not actions. */
class Tester {
  actions = 0;
  readonly log: string[] = [];
  autoOpened = 0;
  constructor(private readonly page: Page) {}

  async tap(target: Locator, what: string) {
    await target.click();
    this.count(`tap ${what}`);
  }

  async type(target: Locator, text: string, what: string) {
    await target.fill(text);
    this.count(`type ${what}`);
  }

  /**
   * Taps a photo button and takes the photo (the shutter is one more action). With `burst`, returns the
   * camera that opened by itself for the next slot, or null when none did within a few seconds.
   */
  async photo(button: Locator, file: Buffer, what: string, burst = false): Promise<FileChooser | null> {
    const [chooser] = await Promise.all([this.page.waitForEvent('filechooser'), button.click()]);
    this.count(`tap ${what}`);
    return this.shutter(chooser, file, what, burst);
  }

  async shutter(chooser: FileChooser, file: Buffer, what: string, burst = false): Promise<FileChooser | null> {
    // Listen before the shutter: the next camera may open at once.
    const next = burst ? this.page.waitForEvent('filechooser', { timeout: 8_000 }).catch(() => null) : Promise.resolve(null);
    await chooser.setFiles({ name: `${what.replace(/\W+/g, '-')}.jpg`, mimeType: 'image/jpeg', buffer: file });
    this.count(`shutter ${what}`);
    return next;
  }

  private count(what: string) {
    this.actions += 1;
    this.log.push(what);
  }
}

test('a full courtside screen (observations, distances, all photos) takes at most 40 actions', async ({ page }, testInfo) => {
  test.setTimeout(240_000);
  const files = await Promise.all([60, 90, 120, 150, 180, 210, 240, 30, 200].map(plainJpeg));
  let nextFile = 0;
  const file = () => files[nextFile++ % files.length]!;

  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-13 mixed')!;
  const roundName = `Courtside ${testInfo.project.name} ${Date.now()}`;
  const created = await page.request.post('/api/rounds', { data: { squadId: squad.id, name: roundName, screenedOn: '2026-09-14' } });
  expect(created.status()).toBe(201);
  const round = (await created.json()) as { round: { id: string }; athletes: { assessmentId: string; athleteId: string; photoConsent: boolean }[] };
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByRole('heading', { name: roundName })).toBeVisible();

  const t = new Tester(page);
  const first = round.athletes.find((a) => a.photoConsent)!;
  await t.tap(page.getByTestId(`round-athlete-${first.athleteId}`), 'athlete');
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');

  await t.type(page.getByTestId('body-stature'), '152', 'standing height');
  await t.type(page.getByTestId('body-sitting'), '79.5', 'sitting height');
  await t.type(page.getByTestId('body-mass'), '41', 'body mass');
  const next = async (counter: string) => {
    await t.tap(page.getByTestId('step-next'), 'next');
    await expect(page.getByTestId('step-counter')).toHaveText(counter);
  };
  await next('Task 1 of 9');

  // Two-leg squat: a tick, then the front photo; the side photo's camera opens by itself (burst).
  await t.tap(page.getByTestId('criterion-squat-right-knee-in'), 'tick');
  const opened = await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo', true);
  // Without the browser letting the camera open again on its own, the side slot is brought into view
  // and takes one more tap: counted either way.
  if (opened) {
    t.autoOpened += 1;
    await t.shutter(opened, file(), 'side photo (opened by itself)');
  } else {
    await t.photo(page.getByTestId('photo-side-camera'), file(), 'side photo');
  }
  await expect(page.getByTestId('photo-front-placed')).toContainText('No landmarks placed yet');
  await expect(page.getByTestId('photo-side-placed')).toContainText('No landmarks placed yet');
  await next('Task 2 of 9');

  // Single-leg squats, landing and stances: one front photo each, a tick where something was seen.
  await t.tap(page.getByTestId('criterion-sls-knee-in'), 'tick');
  await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo');
  await next('Task 3 of 9');
  await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo');
  await next('Task 4 of 9');
  await t.tap(page.getByTestId('criterion-landing-left-knee-in'), 'tick');
  await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo');
  await next('Task 5 of 9');
  await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo');
  await next('Task 6 of 9');
  await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo');
  await next('Task 7 of 9');
  // Knee-to-wall: the distances (their side photos are optional and left out courtside).
  await t.type(page.getByTestId('task-distance'), '7', 'distance');
  await next('Task 8 of 9');
  await t.type(page.getByTestId('task-distance'), '11', 'distance');
  await next('Task 9 of 9');
  // Racket-side lunge: front and side photos.
  const opened2 = await t.photo(page.getByTestId('photo-front-camera'), file(), 'front photo', true);
  if (opened2) {
    t.autoOpened += 1;
    await t.shutter(opened2, file(), 'side photo (opened by itself)');
  } else {
    await t.photo(page.getByTestId('photo-side-camera'), file(), 'side photo');
  }
  await next('All 9 tasks');

  await expect(page.getByTestId('review-to-measure')).toContainText('9 photos have no landmarks yet');
  await page.screenshot({ path: testInfo.outputPath('courtside-review.png'), fullPage: false });
  await t.tap(page.getByTestId('submit-assessment'), 'submit');
  await expect(page).toHaveURL(/\/result$/);

  // The result stands on the ticks and distances alone.
  const detail = await (await page.request.get(`/api/assessments/${first.assessmentId}`)).json();
  expect(detail.status).toBe('submitted');
  expect(detail.photos).toHaveLength(9);
  expect(detail.result.version).toBe(1);
  const flags = detail.result.result.flags as { pattern: string }[];
  expect(flags.some((f) => f.pattern === 'dynamic-knee-valgus')).toBe(true);

  console.log(`[${testInfo.project.name}] courtside screen: ${t.actions} actions (${t.autoOpened} photo slots opened by themselves): ${t.log.join(', ')}`);
  testInfo.annotations.push({ type: 'courtside actions', description: String(t.actions) });
  expect(t.actions).toBeLessThanOrEqual(COURTSIDE_ACTION_BUDGET);
});
