import { expect, test } from './fixtures';
import { signIn } from './helpers';

// A head coach's round: "Start" on the home page while nothing is done, the athletes' flags by severity
// once someone is submitted, then closing the round and reopening it.

test.use({ actionTimeout: 30_000 });

test('a round offers to start, lists flags by severity, and can be closed and reopened by the head coach', async ({ page }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-15 mixed')!;
  // Dated tomorrow, after the demo's rounds, so the home page shows it among the newest (and its screens
  // may be submitted: the server allows a day of slack for time zones, no more).
  const name = `Spring ${testInfo.project.name} ${Date.now()}`;
  const tomorrow = new Date(Date.now() + 24 * 3600 * 1000).toISOString().slice(0, 10);
  const created = await page.request.post('/api/rounds', { data: { squadId: squad.id, name, screenedOn: tomorrow } });
  expect(created.status()).toBe(201);
  const old = await page.request.post('/api/rounds', { data: { squadId: squad.id, name: `Old ${name}`, screenedOn: '2026-01-05' } });
  expect(old.status()).toBe(201);
  const oldId = ((await old.json()) as { round: { id: string } }).round.id;
  const round = (await created.json()) as { round: { id: string }; athletes: { assessmentId: string; athleteId: string }[] };

  await page.reload();
  await expect(page.getByTestId(`continue-round-${round.round.id}`)).toHaveText('Start screening');

  // One athlete screened: a knee well inside the hip-ankle line on the right, a sideways lean on the left.
  const a = round.athletes[0]!;
  const draft = {
    body: {},
    tasks: {
      'two-leg-squat': {
        criteria: ['squat-right-knee-in'],
        landmarks: {
          front: {
            'right-hip': { x: 400, y: 700 },
            'right-knee': { x: 460, y: 900 },
            'right-ankle': { x: 410, y: 1120 },
            'left-hip': { x: 560, y: 700 },
            'left-knee': { x: 560, y: 900 },
            'left-ankle': { x: 560, y: 1120 },
          },
        },
      },
      'single-leg-stance-left': { criteria: ['stance-trunk-shift'] },
    },
  };
  expect((await page.request.put(`/api/assessments/${a.assessmentId}`, { data: { draftVersion: 0, draft } })).ok()).toBe(true);
  expect((await page.request.post(`/api/assessments/${a.assessmentId}/submit`)).ok()).toBe(true);
  await page.reload();
  await expect(page.getByTestId(`continue-round-${round.round.id}`)).toHaveText('Continue screening');

  // Opened by its address, the round is asked for once, by the page itself (before the app knows the
  // club: no X-Club-Id), while the scripts download; the app takes that answer.
  const asked: (string | undefined)[] = [];
  page.on('request', (r) => {
    if (new URL(r.url()).pathname === `/api/rounds/${round.round.id}`) asked.push(r.headers()['x-club-id']);
  });
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByRole('heading', { name })).toBeVisible();
  expect(asked).toEqual([undefined]);
  // Dated ahead of today: nothing said about its date. A round of the same squad dated months back and
  // still open says its date before anyone screens in it.
  await expect(page.getByTestId('round-stale')).toHaveCount(0);
  await page.goto(`/screening/rounds/${oldId}`);
  await expect(page.getByTestId('round-stale')).toContainText('screens here keep that date. Open a new round for today.');
  // Closed again, so the demo's open rounds stay as they were.
  expect((await page.request.post(`/api/rounds/${oldId}/close`)).status()).toBe(200);
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByRole('heading', { name })).toBeVisible();
  const flags = page.getByTestId(`round-flags-${a.athleteId}`);
  await expect(flags).toContainText('▲▲ 1 Concern');
  await expect(flags).toContainText('Watch');
  await expect(flags).toContainText('(right)');
  await page.screenshot({ path: testInfo.outputPath('round-flags.png'), fullPage: true });
  // The same count as the athlete's result page: one per pattern and side.
  const tagText = await flags.innerText();
  const concern = Number(/(\d+) Concern/.exec(tagText)?.[1] ?? 0);
  const watch = Number(/(\d+) Watch/.exec(tagText)?.[1] ?? 0);
  await page.goto(`/screening/assessments/${a.assessmentId}/result`);
  await expect(page.getByTestId('flags')).toContainText(`${concern + watch} flags, ${concern} of concern.`);
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByRole('heading', { name })).toBeVisible();

  // Close it: screening stops, the rows open results; then the head coach reopens it.
  await page.getByTestId('round-close').click();
  await page.getByTestId('round-close-confirm').click();
  await expect(page.getByTestId('round-closed')).toContainText('Dan Mercer');
  await expect(page.getByTestId('screen-next')).toHaveCount(0);
  const api = await page.request.put(`/api/assessments/${round.athletes[1]!.assessmentId}`, { data: { draftVersion: 0, draft: { body: {}, tasks: {} } } });
  expect(api.status()).toBe(409);
  await page.screenshot({ path: testInfo.outputPath('round-closed.png'), fullPage: true });
  await page.getByTestId('round-reopen').click();
  await expect(page.getByTestId('round-closed')).toHaveCount(0);
  await expect(page.getByTestId('screen-next')).toBeVisible();
});

test("the round list shows each squad's latest rounds, and the rest on request or from the home's link", async ({ page }, testInfo) => {
  test.setTimeout(90_000);
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squad = squads.squads.find((s) => s.name === 'Under-15 mixed')!; // not first by name: the link must bring it first
  // Five rounds of an old season, older than any other round: never among the latest four, and never on
  // the home page's newest open rounds that other tests look for.
  const stamp = `${testInfo.project.name} ${Date.now()}`;
  const names: string[] = [];
  for (let i = 1; i <= 5; i++) {
    const name = `Old season ${i} ${stamp}`;
    const created = await page.request.post('/api/rounds', { data: { squadId: squad.id, name, screenedOn: `2020-01-0${i}` } });
    expect(created.status()).toBe(201);
    names.push(name);
  }

  await page.goto('/screening');
  const card = page.getByTestId(`squad-rounds-${squad.id}`);
  await expect(card.getByRole('link')).toHaveCount(4);
  for (const name of names) await expect(card.getByText(name)).toHaveCount(0);
  const more = page.getByTestId(`squad-rounds-all-${squad.id}`);
  await expect(more).toHaveText(/^Show \d+ earlier rounds \(\d+ open\)$/);
  await more.click();
  for (const name of names) await expect(card.getByText(name)).toBeVisible();
  await expect(more).toHaveText('Show only the latest 4');
  await page.screenshot({ path: testInfo.outputPath('round-list-all.png') });
  await more.click();
  await expect(card.getByRole('link')).toHaveCount(4);

  // The home's "All … open rounds" link shows the squad first, with its whole list.
  await page.goto('/');
  await page.getByTestId(`all-open-rounds-${squad.id}`).click();
  await expect(page).toHaveURL(new RegExp(`/screening\\?squad=${squad.id}$`));
  await expect(page.locator('[data-testid^="squad-rounds-"]').first()).toHaveAttribute('data-testid', `squad-rounds-${squad.id}`);
  for (const name of names) await expect(page.getByTestId(`squad-rounds-${squad.id}`).getByText(name)).toBeVisible();
});
