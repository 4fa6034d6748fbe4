import { type APIRequestContext, type BrowserContext, type Page } from '@playwright/test';
import { expect, test, waitForApp } from './fixtures';
import sharp from 'sharp';
import { openNav, signIn } from './helpers';

// Courtside without signal, at both widths (courtside it is the phone, 390x844): the app is opened
// once online, then the network is switched off in the browser. The service worker answers the page
// loads, the device's store answers the data, and changes wait in the outbox until the connection is
// back; then the server holds each change exactly once. Needs the production web build (the worker is
// not registered in `npm run dev`) served from http://127.0.0.1, which browsers treat as a secure
// context.

test.use({ serviceWorkers: 'allow', actionTimeout: 30_000 });

const SHOTS = 'test-results/offline';

/** A plain test card JPEG (no person in it), as a phone camera would give. */
async function cardJpeg(label: string): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="1600">
    <rect width="100%" height="100%" fill="#dfe6e9"/>
    <rect x="200" y="300" width="800" height="1000" fill="#2b4a6f"/>
    <text x="600" y="800" font-size="120" text-anchor="middle" fill="#fff">${label}</text>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

type RoundDetail = {
  round: { id: string };
  athletes: { assessmentId: string; athleteId: string; firstName: string; lastName: string; photoConsent: boolean; status: string }[];
};

async function openRoundByApi(request: APIRequestContext, name: string): Promise<RoundDetail> {
  const squads = (await (await request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-13 mixed')!;
  const res = await request.post('/api/rounds', { data: { squadId: squad.id, name, screenedOn: '2026-11-28' } });
  expect(res.status()).toBe(201);
  const body = (await res.json()) as { round: { id: string } };
  return (await (await request.get(`/api/rounds/${body.round.id}`)).json()) as RoundDetail;
}

/** The keys of the answers kept on this device (IndexedDB `squadline-device`, store `cache`); null when unreadable. */
function keptKeys(page: Page): Promise<string[] | null> {
  return page.evaluate(
    () =>
      new Promise<string[] | null>((resolve) => {
        const open = indexedDB.open('squadline-device');
        open.onsuccess = () => {
          const tx = open.result.transaction('cache', 'readonly');
          const req = tx.objectStore('cache').getAllKeys();
          req.onsuccess = () => resolve(req.result.map(String));
          req.onerror = () => resolve(null);
        };
        open.onerror = () => resolve(null);
      }),
  );
}

/** Online: the worker is active (shell, fonts and screens precached) and the round's drafts are kept. */
async function readyForCourtside(page: Page, athletes: number) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect
    .poll(
      async () => {
        const keys = await keptKeys(page);
        return keys ? keys.filter((k) => k.startsWith('screening.assessment.')).length : -1;
      },
      { timeout: 30_000 },
    )
    .toBeGreaterThanOrEqual(athletes);
}

async function goOffline(context: BrowserContext, page: Page) {
  await context.setOffline(true);
  await expect(page.getByTestId('sync-status-text')).toHaveText(/^Offline/);
  // Really offline: the API cannot be reached from the page.
  const reached = await page.evaluate(() =>
    fetch('/api/health').then(
      () => true,
      () => false,
    ),
  );
  expect(reached).toBe(false);
}

async function nextStep(page: Page, counter: string | RegExp) {
  await page.getByTestId('step-next').click();
  await expect(page.getByTestId('step-counter')).toHaveText(counter);
}

async function addPhoto(page: Page, view: 'front' | 'side', photo: Buffer) {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId(`photo-${view}-library`).click()]);
  await chooser.setFiles({ name: `${view}.jpg`, mimeType: 'image/jpeg', buffer: photo });
}

test('a whole round screened with no connection syncs once, in order, without duplicates', async ({ page, context }, testInfo) => {
  test.setTimeout(240_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const round = await openRoundByApi(page.request, `Offline ${testInfo.project.name} ${Date.now()}`);
  const [first, second] = round.athletes.filter((a) => a.photoConsent).sort((a, b) => a.lastName.localeCompare(b.lastName));
  const open = round.athletes.length;

  const { clearances } = (await (await page.request.get('/api/clearances')).json()) as { clearances: Record<string, { status: string }> };
  // Online: open the round once; the app keeps it, its athletes and their open drafts on the phone.
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByTestId(`round-athlete-${first!.athleteId}`)).toBeVisible();
  await expect(page.getByTestId('sync-status-text')).toHaveText('All saved');
  await readyForCourtside(page, open);

  // The hall has no signal. A reload still opens the round: the page from the worker, data from the phone.
  await goOffline(context, page);
  const reload = await page.reload();
  expect(reload?.fromServiceWorker()).toBe(true);
  await expect(page.getByTestId(`round-athlete-${first!.athleteId}`)).toBeVisible();
  await expect(page.getByTestId('sync-status-text')).toHaveText('Offline');
  // The physiotherapist's decisions stay in view with no signal: a referral's badge (the demo has one in this squad).
  const referred = round.athletes.find((a) => clearances[a.athleteId]?.status === 'referred');
  expect(referred, 'an athlete of the squad referred on').toBeDefined();
  await expect(page.getByTestId(`round-athlete-${referred!.athleteId}`).getByTestId('clearance-badge')).toContainText('Refer on');

  // First athlete: measurements, a ticked criterion and a front photo, then submit.
  await page.getByTestId(`round-athlete-${first!.athleteId}`).click();
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');
  await page.getByTestId('body-stature').fill('151');
  await page.getByTestId('body-sitting').fill('78');
  await page.getByTestId('body-mass').fill('40');
  await expect(page.getByTestId('save-status')).toHaveText('Kept on this phone');
  await nextStep(page, 'Task 1 of 9');
  await page.getByTestId('criterion-squat-right-knee-in').click();
  await addPhoto(page, 'front', await cardJpeg('A front'));
  await expect(page.getByTestId('photo-front-waiting')).toContainText('Kept on this phone');
  await expect(page.getByTestId('sync-status-text')).toHaveText(/^Offline · [2-9] waiting$/);
  // Landmarks go on the photo kept on the phone, in its own pixels (the size the server stores).
  await page.getByTestId('photo-front-landmarks').click();
  const surface = page.getByTestId('landmark-surface');
  await expect(surface).toBeVisible();
  const box = (await surface.boundingBox())!;
  await surface.click({ position: { x: 0.43 * box.width, y: 0.48 * box.height } });
  await surface.click({ position: { x: 0.46 * box.width, y: 0.66 * box.height } });
  await page.getByTestId('landmarks-done').click();
  await expect(page.getByTestId('photo-front-placed')).toHaveText('2 of 10 landmarks placed.');
  await page.screenshot({ path: `${SHOTS}/offline-capture-${testInfo.project.name}.png` });
  for (let task = 2; task <= 9; task += 1) await nextStep(page, `Task ${task} of 9`);
  await nextStep(page, 'All 9 tasks');
  await expect(page.getByTestId('submit-offline')).toBeVisible();
  await expect(page.getByTestId('uploads-unfinished')).toBeVisible();
  await page.getByTestId('submit-assessment').click();
  await expect(page).toHaveURL(new RegExp(`/screening/rounds/${round.round.id}$`));
  await expect(page.getByTestId(`round-athlete-${first!.athleteId}`)).toContainText('Submitted on this phone · waiting to send');
  // The round's count says it the same way, not "in progress".
  await expect(page.getByText(/1 submitted on this phone, waiting to send/)).toBeVisible();

  // Second athlete: measurements and two photos, not submitted.
  await page.getByTestId(`round-athlete-${second!.athleteId}`).click();
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');
  await page.getByTestId('body-stature').fill('158');
  await page.getByTestId('body-mass').fill('45');
  await nextStep(page, 'Task 1 of 9');
  await addPhoto(page, 'front', await cardJpeg('B front'));
  await expect(page.getByTestId('photo-front-waiting')).toBeVisible();
  await nextStep(page, 'Task 2 of 9');
  await addPhoto(page, 'front', await cardJpeg('B single leg'));
  await expect(page.getByTestId('photo-front-waiting')).toBeVisible();

  // Another reload with no signal: the queue, the photos and the typing are all still on the phone.
  await page.reload();
  await expect(page.getByTestId('step-counter')).toHaveText('Task 2 of 9');
  await expect(page.getByTestId('photo-front-waiting')).toBeVisible();
  await expect(page.locator('img[src^="blob:"]').first()).toBeVisible();
  await page.getByTestId('step-back').click();
  await page.getByTestId('step-back').click();
  await expect(page.getByTestId('body-stature')).toHaveValue('158');
  await page.getByTestId('sync-status').click();
  await expect(page.getByTestId('sync-status-details')).toContainText('Photos kept on this phone');
  await page.screenshot({ path: `${SHOTS}/offline-status-${testInfo.project.name}.png` });
  await page.getByTestId('sync-status').click();
  await expect(page.getByTestId('sync-status-details')).toHaveCount(0);
  await expect(page).toHaveURL(new RegExp(`/screening/assessments/${second!.assessmentId}$`));

  // Signing out now would delete the waiting changes: the app says so and lets the tester stay.
  await openNav(page);
  await page.getByTestId('sign-out').click();
  await expect(page.getByTestId('sign-out-warning')).toContainText('not on the server yet');
  await page.screenshot({ path: `${SHOTS}/sign-out-warning-${testInfo.project.name}.png` });
  await page.getByTestId('sign-out-cancel').click();
  if (await page.getByTestId('menu-button').isVisible()) await page.getByTestId('menu-button').click();
  await expect(page).toHaveURL(new RegExp(`/screening/assessments/${second!.assessmentId}$`));
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');

  // Signal again: everything goes out in order and the status settles on "All saved".
  await context.setOffline(false);
  await page.waitForTimeout(150);
  await page.screenshot({ path: `${SHOTS}/syncing-${testInfo.project.name}.png` });
  await expect(page.getByTestId('sync-status-text')).toHaveText('All saved', { timeout: 60_000 });
  await expect(page.getByTestId('save-status')).toHaveText('✓ Saved');
  // Back in the round, it says which screen that waited on the phone reached the server, once.
  await page.locator(`a[href="/screening/rounds/${round.round.id}"]`).first().click();
  await expect(page.getByTestId('round-sent')).toContainText(`${first!.firstName} ${first!.lastName}`);
  await page.screenshot({ path: `${SHOTS}/round-sent-${testInfo.project.name}.png` });
  await page.getByTestId('round-sent-close').click();
  await expect(page.getByTestId('round-sent')).toHaveCount(0);

  // The server holds exactly what was done: both drafts, three photos, one result.
  const a = await (await page.request.get(`/api/assessments/${first!.assessmentId}`)).json();
  expect(a.status).toBe('submitted');
  expect(a.draft.body).toMatchObject({ statureCm: 151, sittingHeightCm: 78, massKg: 40 });
  expect(a.draft.tasks['two-leg-squat'].criteria).toContain('squat-right-knee-in');
  expect(a.photos).toHaveLength(1);
  expect(Object.keys(a.draft.tasks['two-leg-squat'].landmarks.front)).toHaveLength(2);
  expect(a.photos[0]).toMatchObject({ width: 1200, height: 1600 });
  expect(a.result.version).toBe(1);
  expect(a.result.history).toEqual([]);
  const b = await (await page.request.get(`/api/assessments/${second!.assessmentId}`)).json();
  expect(b.status).toBe('in_progress');
  expect(b.draft.body).toMatchObject({ statureCm: 158, massKg: 45 });
  expect(b.photos).toHaveLength(2);
  expect(b.result).toBeNull();
  const after = (await (await page.request.get(`/api/rounds/${round.round.id}`)).json()) as RoundDetail;
  expect(after.athletes.filter((x) => x.status === 'submitted').map((x) => x.assessmentId)).toEqual([first!.assessmentId]);
  await page.screenshot({ path: `${SHOTS}/all-saved-${testInfo.project.name}.png` });
});

test('the same draft edited on two phones, one of them offline, is merged when it comes back', async ({ browser, page }, testInfo) => {
  test.setTimeout(180_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const round = await openRoundByApi(page.request, `Two phones ${testInfo.project.name} ${Date.now()}`);
  const athlete = round.athletes.find((a) => a.photoConsent)!;
  const capture = `/screening/assessments/${athlete.assessmentId}`;

  // The second phone: its own browser, signed in as the same tester, opens the same athlete online.
  const other = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, serviceWorkers: 'allow' });
  const phone2 = await other.newPage();
  await signIn(phone2, 'tester@squadline.test');
  await expect(phone2.getByTestId('home-tester')).toBeVisible();
  await phone2.goto(`/screening/rounds/${round.round.id}`);
  await waitForApp(phone2);
  await readyForCourtside(phone2, round.athletes.length);
  await phone2.getByTestId(`round-athlete-${athlete.athleteId}`).click();
  await expect(phone2.getByTestId('step-title')).toHaveText('Body measurements');

  // Phone 2 loses the signal and keeps working: mass, and a tick on task 1.
  await goOffline(other, phone2);
  await phone2.getByTestId('body-mass').fill('44');
  await nextStep(phone2, 'Task 1 of 9');
  await phone2.getByTestId('criterion-squat-right-knee-in').click();
  await expect(phone2.getByTestId('save-status')).toHaveText('Kept on this phone');

  // Phone 1, online, saves first: heights, and a different tick on the same task.
  await page.goto(capture);
  await expect(page.getByTestId('step-title')).toHaveText('Body measurements');
  await page.getByTestId('body-stature').fill('149');
  await page.getByTestId('body-sitting').fill('77');
  await nextStep(page, 'Task 1 of 9');
  await page.getByTestId('criterion-squat-left-knee-in').click();
  await expect(page.getByTestId('save-status')).toHaveText('✓ Saved');

  // Phone 2 is back: its save meets the newer one, both are merged and it says so.
  await other.setOffline(false);
  await expect(phone2.getByText('Merged with a newer save')).toBeVisible({ timeout: 30_000 });
  await expect(phone2.getByTestId('save-status')).toHaveText('✓ Saved');
  await expect(phone2.getByTestId('sync-status-text')).toHaveText('All saved');
  await expect(phone2.getByTestId('criterion-squat-left-knee-in')).toHaveAttribute('aria-checked', 'true');
  await expect(phone2.getByTestId('criterion-squat-right-knee-in')).toHaveAttribute('aria-checked', 'true');
  await phone2.screenshot({ path: `${SHOTS}/merged-${testInfo.project.name}.png` });
  const server = await (await page.request.get(`/api/assessments/${athlete.assessmentId}`)).json();
  expect(server.draft.body).toMatchObject({ statureCm: 149, sittingHeightCm: 77, massKg: 44 });
  expect([...server.draft.tasks['two-leg-squat'].criteria].sort()).toEqual(['squat-left-knee-in', 'squat-right-knee-in']);
  await other.close();
});

test('without a connection the screening page offers the rounds kept on this device', async ({ page, context }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const name = `Kept ${testInfo.project.name} ${Date.now()}`;
  const round = await openRoundByApi(page.request, name);
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByRole('heading', { name })).toBeVisible();
  await readyForCourtside(page, round.athletes.length);

  await goOffline(context, page);
  await page.goto('/screening');
  await expect(page.getByTestId('kept-rounds')).toContainText('The rounds you opened on this phone are kept here');
  await page.getByTestId('sync-status').click();
  await expect(page.getByTestId('sync-status-details')).toContainText('No connection');
  await page.screenshot({ path: `${SHOTS}/kept-rounds-${testInfo.project.name}.png` });
  await page.getByTestId('sync-status').click();
  await page.getByRole('link', { name: new RegExp(name) }).click();
  await expect(page.getByRole('heading', { name })).toBeVisible();
  await expect(page.getByTestId('sync-status-text')).toHaveText('Offline');
  await context.setOffline(false);
  await expect(page.getByTestId('sync-status-text')).toHaveText('All saved');
});

test('a training sheet opened online opens again in a gym with no connection', async ({ page, context }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-13 mixed')!;
  await page.goto(`/training?squad=${squad.id}`);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Under-13 mixed');
  const cards = page.locator('[data-testid^="sheet-exercise-"]');
  await expect(cards.first()).toBeVisible();
  const count = await cards.count();
  // Online: the worker is ready and the sheet is kept on the device.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(async () => (await keptKeys(page))?.includes(`training.sheet.${squad.id}`) ?? false, { timeout: 30_000 }).toBe(true);

  await goOffline(context, page);
  const reload = await page.reload();
  expect(reload?.fromServiceWorker()).toBe(true);
  await expect(page.getByTestId('sheet-offline')).toBeVisible();
  await expect(cards).toHaveCount(count);
  await page.screenshot({ path: `${SHOTS}/training-sheet-offline-${testInfo.project.name}.png` });
  await context.setOffline(false);
});

test('who took part is recorded with no connection and reaches the server once it is back', async ({ page, context }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  // Not the squad and days the training test records on: the two projects run at once, so each takes
  // its own day (yesterday, the day before).
  const squad = squads.squads.find((s) => s.name === 'Under-15 mixed')!;
  const dayIndex = testInfo.project.name === 'phone' ? 1 : 2;
  const note = `Kept offline, ${testInfo.project.name} ${Date.now()}`;
  await page.goto(`/training?squad=${squad.id}`);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Under-15 mixed');
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect
    .poll(
      async () => {
        const keys = (await keptKeys(page)) ?? [];
        return keys.includes(`training.sheet.${squad.id}`) && keys.includes(`training.sessions.${squad.id}`);
      },
      { timeout: 30_000 },
    )
    .toBe(true);

  // No connection: the sheet and its sessions open from the phone, and the record waits there.
  await goOffline(context, page);
  await page.reload();
  await expect(page.getByTestId('sheet-offline')).toBeVisible();
  await page.getByTestId('sheet-record-open').click();
  const form = page.getByTestId('sheet-record-form');
  await form.getByTestId('sheet-record-day').getByRole('radio').nth(dayIndex).click();
  await form.getByRole('button', { name: 'Untick all' }).click();
  const ticks = form.locator('[data-testid^="sheet-tick-"]');
  const chosen: string[] = [];
  for (const i of [0, 1]) {
    await ticks.nth(i).click();
    chosen.push((await ticks.nth(i).getAttribute('data-testid'))!.replace('sheet-tick-', ''));
  }
  await form.getByTestId('sheet-record-note').fill(note);
  await form.getByTestId('sheet-record-save').click();
  await expect(page.getByTestId('sheet-recorded')).toContainText('Kept on this phone');
  await expect(page.getByTestId('sheet-session-waiting')).toContainText('2 athletes');
  await expect(page.getByTestId('sync-status-text')).toHaveText('Offline · 1 waiting');
  await page.screenshot({ path: `${SHOTS}/training-record-offline-${testInfo.project.name}.png` });

  // Still there after a reload with no connection (kept on the device, not in the page's memory).
  await page.reload();
  await expect(page.getByTestId('sheet-session-waiting')).toContainText('2 athletes');

  // Back online: sent once, the list shows it from the server, nothing waits on the phone.
  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event('online')));
  await expect(page.getByTestId('sync-status-text')).toHaveText('All saved', { timeout: 30_000 });
  await expect(page.getByTestId('sheet-session-waiting')).toHaveCount(0);

  // The same day again with no connection and no reload: the form starts from what was recorded, and the
  // notice follows the record, no longer "kept on this phone" once it is on the server.
  await goOffline(context, page);
  await page.getByTestId('sheet-record-open').click();
  await form.getByTestId('sheet-record-day').getByRole('radio').nth(dayIndex).click();
  await expect(form.getByTestId('sheet-record-note')).toHaveValue(note);
  await form.getByTestId('sheet-record-save').click();
  await expect(page.getByTestId('sheet-recorded')).toContainText('Kept on this phone');
  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event('online')));
  await expect(page.getByTestId('sheet-recorded')).toContainText('Sent once the connection came back.', { timeout: 30_000 });
  await expect(page.getByTestId('sync-status-text')).toHaveText('All saved');
  const sessions = (await (await page.request.get(`/api/squads/${squad.id}/training-sessions`)).json()) as {
    sessions: { heldOn: string; athleteIds: string[]; note: string }[];
  };
  const sent = sessions.sessions.filter((s) => s.note === note);
  expect(sent).toHaveLength(1);
  expect([...sent[0]!.athleteIds].sort()).toEqual([...chosen].sort());
});
