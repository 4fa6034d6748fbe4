import fs from 'node:fs';
import path from 'node:path';
import { type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { signIn } from './helpers';
import { CHROMIUM_ARGS } from '../chromium-args.mjs';

// Suggested points: the pose model runs in the browser on a real photograph of a person, the coach drags
// one suggestion, confirms, and the saved points record which were suggested and which were moved.
//
// The photograph: `basketball1.png` (640x480, grey; an anonymous person standing full-body on the left)
// from Debian's package `opencv-doc` (examples/data/ under its doc folder), licence "Apache-2.0 AND
// BSD-3-Clause" per the package's copyright file. `npm test` installs or unpacks the package when missing
// and passes the folder as SAMPLE_PHOTOS_DIR (server/dev/bootstrap.mjs, ensureSamplePhotos).
const PHOTO_PACKAGE = 'opencv-doc';
const PHOTO_FILE = 'basketball1.png';
const PHOTO_LICENCE = 'Apache-2.0 AND BSD-3-Clause';
const PHOTO_WIDTH = 640;

/**
 * Joint centres placed by hand once on the photo, in its own pixels (read off 3x and 5x enlargements with
 * a 20 px grid). The person faces the camera, so their right leg is on the image's left. Hips: middle of the
 * thigh just below the waistband; knees: middle of the knee, where the trousers crease; ankles: just above
 * the shoe, where the trouser hem ends.
 */
const HAND_PLACED = {
  'right-hip': { x: 68, y: 292 },
  'left-hip': { x: 116, y: 292 },
  'right-knee': { x: 65, y: 375 },
  'left-knee': { x: 120, y: 378 },
  'right-ankle': { x: 60, y: 464 },
  'left-ankle': { x: 123, y: 451 },
} as const;
type Joint = keyof typeof HAND_PLACED;

/**
 * Our choice: a suggestion within 40 px of the hand-placed centre (about a tenth of the person's 400 px
 * height on this photo) is close enough to be dragged into place rather than placed again.
 */
const TOLERANCE_PX = 40;

// WebGL for the model's runtime through SwiftShader (no GPU on the test machine), for this file only.
test.use({
  actionTimeout: 30_000,
  launchOptions: {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', ...CHROMIUM_ARGS, '--use-gl=swiftshader', '--enable-unsafe-swiftshader'],
  },
});

function samplePhoto(): Buffer {
  const dir = process.env.SAMPLE_PHOTOS_DIR;
  const file = dir ? path.join(dir, PHOTO_FILE) : '';
  if (!dir || !fs.existsSync(file)) {
    throw new Error(
      `${PHOTO_FILE} from Debian's ${PHOTO_PACKAGE} (${PHOTO_LICENCE}) is missing: run the browser tests through \`npm test\`, which installs it.`,
    );
  }
  return fs.readFileSync(file);
}

/** A round with one athlete whose front squat photo is the sample photograph, uploaded like any photo. */
async function roundWithPhoto(page: Page, label: string) {
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-13 mixed')!;
  const created = await page.request.post('/api/rounds', { data: { squadId: squad.id, name: `Suggest ${label} ${Date.now()}`, screenedOn: '2026-09-14' } });
  expect(created.status()).toBe(201);
  const round = (await created.json()) as { round: { id: string }; athletes: { assessmentId: string; photoConsent: boolean }[] };
  const a = round.athletes.find((x) => x.photoConsent)!;
  const res = await page.request.post(`/api/assessments/${a.assessmentId}/photos`, {
    multipart: { task: 'two-leg-squat', view: 'front', photo: { name: PHOTO_FILE, mimeType: 'image/png', buffer: samplePhoto() } },
  });
  expect(res.status()).toBe(201);
  const photo = (await res.json()) as { id: string; width: number; height: number };
  return { roundId: round.round.id, assessmentId: a.assessmentId, photo };
}

test('the pose model suggests the points of a real photograph; a moved point and the confirmed ones are saved as such', async ({ page, baseURL }, testInfo) => {
  // The model's first run is slow on a shared machine without a GPU (SwiftShader renders WebGL on the CPU).
  test.setTimeout(600_000);
  // Every request the page makes stays on our origin: the model files and the photo never go elsewhere.
  const origins = new Set<string>();
  page.on('console', (m) => {
    if (m.type() === 'error') console.log(`[${testInfo.project.name}] browser console: ${m.text().slice(0, 300)}`);
  });
  page.on('pageerror', (e) => console.log(`[${testInfo.project.name}] page error: ${e.message}`));
  page.on('request', (r) => {
    if (r.url().startsWith('http')) origins.add(new URL(r.url()).origin);
  });

  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  const { roundId, assessmentId, photo } = await roundWithPhoto(page, testInfo.project.name);
  const scale = photo.width / PHOTO_WIDTH;

  await page.goto(`/measuring?roundId=${roundId}`);
  await expect(page.getByTestId('measure-current')).toContainText('Two-leg full squat, front photo');
  const surface = page.getByTestId('landmark-surface');
  await expect(surface).toBeVisible();

  const started = Date.now();
  await page.getByTestId('suggest-run').click();
  await expect(page.getByTestId('suggest-confirm')).toBeVisible({ timeout: 480_000 });
  const seconds = ((Date.now() - started) / 1000).toFixed(1);

  // Waiting suggestions are not placed points: nothing is measured from them yet.
  await expect(page.getByTestId('landmark-next')).toContainText('suggested points');
  await expect(page.getByText('Points (0 of 10 placed)')).toBeVisible();
  await expect(page.getByTestId('live-angles')).toContainText('Angles appear here as soon as the points they need are placed.');
  await page.screenshot({ path: testInfo.outputPath('suggested-waiting.png') });

  // The suggestions as drawn (photo pixels, the SVG's own coordinates).
  const suggested = await page.evaluate(() => {
    const out: Record<string, { x: number; y: number }> = {};
    for (const g of Array.from(document.querySelectorAll('[data-testid^="suggested-"]'))) {
      const c = g.querySelector('circle')!;
      out[g.getAttribute('data-testid')!.slice('suggested-'.length)] = { x: Number(c.getAttribute('cx')), y: Number(c.getAttribute('cy')) };
    }
    return out;
  });
  // The front hip bones have no counterpart in the model: never suggested.
  expect(Object.keys(suggested)).not.toContain('right-asis');
  expect(Object.keys(suggested)).not.toContain('left-asis');

  const rows = (Object.keys(HAND_PLACED) as Joint[]).map((id) => {
    const hand = { x: HAND_PLACED[id].x * scale, y: HAND_PLACED[id].y * scale };
    const s = suggested[id];
    const distance = s ? Math.hypot(s.x - hand.x, s.y - hand.y) / scale : Number.NaN;
    return { id, hand: `${hand.x.toFixed(0)},${hand.y.toFixed(0)}`, suggested: s ? `${s.x.toFixed(0)},${s.y.toFixed(0)}` : 'none', distance };
  });
  console.log(
    [
      `[${testInfo.project.name}] ${PHOTO_FILE} (${PHOTO_PACKAGE}, ${PHOTO_LICENCE}), stored at ${photo.width}x${photo.height}: suggestion in ${seconds} s`,
      'point        hand-placed  suggested  distance (px of the 640 px original)',
      ...rows.map((r) => `${r.id.padEnd(12)} ${r.hand.padEnd(12)} ${r.suggested.padEnd(10)} ${Number.isNaN(r.distance) ? '-' : r.distance.toFixed(1)}`),
    ].join('\n'),
  );
  for (const r of rows) {
    expect(r.suggested, `${r.id} suggested`).not.toBe('none');
    expect(r.distance, `${r.id} within ${TOLERANCE_PX} px of the hand-placed point`).toBeLessThanOrEqual(TOLERANCE_PX);
  }

  // Drag the suggested right knee onto the hand-placed one, by way of a detour so the press always turns
  // into a drag, even when the suggestion was already close.
  const box = (await surface.boundingBox())!;
  const toScreen = (p: { x: number; y: number }) => ({ x: box.x + (p.x / photo.width) * box.width, y: box.y + (p.y / photo.height) * box.height });
  const handKnee = { x: HAND_PLACED['right-knee'].x * scale, y: HAND_PLACED['right-knee'].y * scale };
  const from = toScreen(suggested['right-knee']!);
  const to = toScreen(handKnee);
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  await page.mouse.move(from.x + 30, from.y + 20, { steps: 4 });
  await page.mouse.move(to.x, to.y, { steps: 4 });
  await page.mouse.up();
  await expect(page.getByText('Points (0 of 10 placed)')).toBeVisible();

  const count = Object.keys(suggested).length;
  await page.getByTestId('suggest-confirm').click();
  await expect(page.getByText(`Points (${count} of 10 placed)`)).toBeVisible();
  await expect(page.getByTestId('live-angles')).toContainText('Right knee angle from the front (FPPA)');
  await page.screenshot({ path: testInfo.outputPath('suggested-confirmed.png') });
  await page.getByTestId('measure-save-next').click();
  await expect(page.getByTestId('measure-saved')).toBeVisible();

  const detail = await (await page.request.get(`/api/assessments/${assessmentId}`)).json();
  const saved = detail.draft.tasks['two-leg-squat'].landmarks.front as Record<string, { x: number; y: number; source?: string }>;
  expect(saved['right-knee']!.source).toBe('moved');
  // Where the drag ended, within the rounding of screen to photo pixels.
  expect(Math.abs(saved['right-knee']!.x - handKnee.x)).toBeLessThan(2 * scale);
  expect(Math.abs(saved['right-knee']!.y - handKnee.y)).toBeLessThan(2 * scale);
  for (const id of Object.keys(suggested).filter((k) => k !== 'right-knee')) {
    expect(saved[id], id).toEqual({ ...suggested[id], source: 'suggested' });
  }
  expect(saved['right-asis']).toBeUndefined();
  expect([...origins]).toEqual([new URL(baseURL!).origin]);
});
