import fs from 'node:fs';
import { type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { openNav, signIn } from './helpers';

// Squad trends as the demo head coach (three past rounds per squad in the demo), and one athlete's
// history: loads, filters, sorts, downloads the filtered table as CSV, and draws charts with data.

async function names(page: Page): Promise<string[]> {
  const rows = page.getByTestId('trends-row');
  const n = await rows.count();
  const out: string[] = [];
  for (let i = 0; i < n; i++) out.push(((await rows.nth(i).locator('a').first().textContent()) ?? '').trim());
  return out;
}

async function chooseDemoSquad(page: Page) {
  await page.getByTestId('squad-choice').getByText('Under-13 mixed', { exact: true }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Under-13 mixed');
}

async function shownCount(page: Page): Promise<number> {
  const text = (await page.getByTestId('row-count').textContent()) ?? '';
  return Number(text.split(' ')[0]);
}

/** An athlete's movement flags (the filters' "any" and "none" leave the growth-spurt window out). */
const movementFlags = (flags: Record<string, string[]>) =>
  Object.values(flags)
    .flat()
    .filter((p) => p !== 'growth-spurt-window').length;

test('squad trends: load, filter, sort, CSV, charts', async ({ page }, info) => {
  // Many steps and four screenshots: give it the time of three ordinary tests on a busy machine.
  test.slow();
  await signIn(page, 'coach@squadline.test');
  await page.getByTestId('home-trends-link').click();
  await expect(page.getByTestId('squad-trends')).toBeVisible();
  // The demo squad with its past rounds (other tests add squads of their own, which may sort first).
  await chooseDemoSquad(page);
  await expect(page.getByTestId('trends-row').first()).toBeVisible();
  const all = await shownCount(page);
  expect(all).toBeGreaterThan(3);
  expect(await page.getByTestId('trends-row').count()).toBe(all);

  // A chart with data: the flag-share lines are drawn (SVG paths), and its numbers table has rows per round.
  const share = page.getByTestId('flag-share-chart');
  await expect(share.locator('svg path').first()).toBeAttached();
  expect(await share.locator('svg path').count()).toBeGreaterThan(3);
  await expect(share.getByRole('table')).toBeAttached();
  expect(await share.getByRole('row').count()).toBeGreaterThanOrEqual(4); // header + 3 demo rounds
  await expect(page.getByTestId('knee-distribution-chart').locator('svg circle, svg path').first()).toBeAttached();

  // Filter: only athletes whose latest screen raised any flag (on a phone the filters fold away).
  if (info.project.name === 'phone') await page.getByTestId('toggle-filters').click();
  await page.getByTestId('filter-flag-any').click();
  const flagged = await shownCount(page);
  expect(flagged).toBeLessThan(all);
  expect(flagged).toBeGreaterThan(0);
  expect(await page.getByTestId('trends-row').count()).toBe(flagged);

  // Sort by name, then the other way.
  const ascending = await names(page);
  if (info.project.name === 'wide') await page.getByTestId('sort-name').click();
  else await page.getByTestId('sort-choice-name').click();
  const descending = await names(page);
  expect(descending).toEqual([...ascending].reverse());
  expect(descending).not.toEqual(ascending);

  // Sort by the sessions taken part in since the newest screen: lowest share first (the demo records a
  // season of sessions), rows with nothing to count last.
  if (info.project.name === 'wide') await page.getByTestId('sort-sessions').click();
  else await page.getByTestId('sort-choice-sessions').click();
  const rowTexts = await page.getByTestId('trends-row').allInnerTexts();
  const shares = rowTexts.map((t) => {
    const m = /(\d+) of (?:the )?(\d+)/.exec(t.replace(/\s+/g, ' '));
    return m ? Number(m[1]) / Number(m[2]) : Infinity;
  });
  expect(shares.filter(Number.isFinite).length, rowTexts.join(' | ')).toBeGreaterThan(0);
  expect(shares).toEqual([...shares].sort((x, y) => x - y));

  // CSV of the filtered table: the same athletes, one line each after the header.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
  expect(download.suggestedFilename()).toMatch(/-trends-\d{4}-\d{2}-\d{2}-only-[A-Za-z0-9-]+\.csv$/);
  const csv = fs
    .readFileSync((await download.path())!, 'utf8')
    .trim()
    .split('\n');
  expect(csv[0]).toMatch(/^last_name,first_name,sex,age_group/);
  expect(csv).toHaveLength(flagged + 1);
  const csvNames = csv.slice(1).map((line) => {
    const [last, first] = line.split(',');
    return `${first} ${last}`;
  });
  const shown = ascending.map((n) => (n.includes(',') ? n.split(', ').reverse().join(' ') : n));
  expect(csvNames.sort()).toEqual(shown.sort());

  // Filters that keep nobody say so and clear in one tap. A combination with no athlete in this squad,
  // found from the API's rows (sex, maturity band, any or no flag).
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squadId = squads.squads.find((q) => q.name === 'Under-13 mixed')!.id;
  const trends = (await (await page.request.get(`/api/squads/${squadId}/trends`)).json()) as {
    athletes: { sex: string; maturityBand: string | null; latestFlags: Record<string, string[]> }[];
  };
  const combos = ['female', 'male'].flatMap((sex) =>
    ['pre', 'circa', 'post', 'unknown'].flatMap((band) => ['any', 'none'].map((flag) => ({ sex, band, flag }))),
  );
  const empty = combos.find(
    (c) => !trends.athletes.some((a) => a.sex === c.sex && (a.maturityBand ?? 'unknown') === c.band && movementFlags(a.latestFlags) > 0 === (c.flag === 'any')),
  );
  expect(empty, 'some combination of filters keeps nobody in the demo squad').toBeTruthy();
  await page.getByTestId(`filter-sex-${empty!.sex}`).click();
  await page.getByTestId(`filter-band-${empty!.band}`).click();
  await page.getByTestId(`filter-flag-${empty!.flag}`).click();
  await expect(page.getByTestId('trends-no-match')).toBeVisible();
  await expect(page.getByTestId('charts-filter-note')).toBeVisible();
  await page.getByTestId('clear-filters').click();
  await expect(page.getByTestId('trends-no-match')).toHaveCount(0);
  expect(await shownCount(page)).toBe(all);

  if (info.project.name === 'phone') await page.getByTestId('toggle-filters').click();
  await page.screenshot({ path: `test-results/trends-${info.project.name}.png`, fullPage: true });
  await share.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `test-results/trends-charts-${info.project.name}.png` });
  await page.getByTestId('change-chart').scrollIntoViewIfNeeded();
  await page.screenshot({ path: `test-results/trends-change-${info.project.name}.png` });
  await page.emulateMedia({ media: 'print' });
  const printed = (await page.getByTestId('squad-trends').boundingBox())!;
  expect(printed.x).toBe(0);
  await page.screenshot({ path: `test-results/trends-print-${info.project.name}.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  // The report prints on one page: the browser's print announces itself (beforeprint), and the report is
  // scaled to the page. Counted in the PDF Chromium makes of the page (its page objects).
  await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
  // On a phone too, the page gets the table (not the cards) and the charts are drawn.
  await expect(page.getByTestId('trends-table')).toBeVisible();
  await expect(page.getByTestId('flag-share-chart').locator('svg').first()).toBeAttached();
  const pdf = (await page.pdf({ preferCSSPageSize: true, printBackground: true })).toString('latin1');
  expect(pdf.match(/\/Type\s*\/Page[^s]/g)).toHaveLength(1);
  await page.evaluate(() => window.dispatchEvent(new Event('afterprint')));
  if (info.project.name === 'phone') await expect(page.getByTestId('trends-table')).toHaveCount(0);

  // The navigation leads here too.
  await openNav(page);
  await expect(page.getByRole('link', { name: 'Squad trends' })).toBeVisible();
});

test('athlete history: charts with threshold and error band, and the last two screens compared', async ({ page }, info) => {
  await signIn(page, 'coach@squadline.test');
  await page.getByTestId('home-trends-link').click();
  await chooseDemoSquad(page);
  // An athlete whose screens raised flags, so a plan was in place between them, screened on different
  // days in the demo's rounds, with sessions recorded since (other browser tests may add same-day
  // screens to some demo athletes: they are passed over).
  const squads = (await (await page.request.get('/api/squads')).json()) as { squads: { id: string; name: string }[] };
  const squadId = squads.squads.find((q) => q.name === 'Under-13 mixed')!.id;
  const trends = (await (await page.request.get(`/api/squads/${squadId}/trends`)).json()) as {
    athletes: { id: string; firstName: string; lastName: string; latestFlags: Record<string, string[]> }[];
  };
  let chosen: { firstName: string; lastName: string } | undefined;
  for (const a of trends.athletes.filter((x) => movementFlags(x.latestFlags) > 0)) {
    const p = (await (await page.request.get(`/api/athletes/${a.id}/progress`)).json()) as {
      comparison: { planTime: { days: number; noPlanNeeded: boolean } } | null;
      sessionsSinceLatest: { held: number } | null;
      screens: { plan: { exercises: number } }[];
    };
    if (
      p.comparison &&
      p.comparison.planTime.days >= 7 &&
      !p.comparison.planTime.noPlanNeeded &&
      (p.sessionsSinceLatest?.held ?? 0) > 0 &&
      p.screens.at(-1)!.plan.exercises > 0
    ) {
      chosen = a;
      break;
    }
  }
  expect(chosen, 'a flagged demo athlete with two screens and sessions since').toBeTruthy();
  if (info.project.name === 'phone') await page.getByTestId('toggle-filters').click();
  await page.getByTestId('filter-flag-any').click();
  await page
    .getByTestId('trends-row')
    .getByRole('link', { name: new RegExp(`^(${chosen!.firstName} ${chosen!.lastName}|${chosen!.lastName}, ${chosen!.firstName})$`) })
    .first()
    .click();
  const section = page.getByTestId('athlete-progress');
  await expect(section).toBeVisible();
  await expect(page.getByTestId('progress-comparison')).toBeVisible();
  await expect(page.getByTestId('plan-time')).toContainText(/weeks/);
  // The demo squad records its autumn sessions after the newest screen.
  await expect(page.getByTestId('sessions-since')).toContainText(/^Since the screen of .+ corrective sessions? the squad recorded/);
  const chart = page.getByTestId('history-chart').first();
  await expect(chart.locator('svg path').first()).toBeAttached();
  await expect(chart.getByRole('table')).toBeAttached();
  await section.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `test-results/athlete-history-${info.project.name}.png` });
  await chart.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `test-results/athlete-chart-${info.project.name}.png` });
});

// our choice: the head coach's home says, per squad, what to act on (the trends table summed), with the
// way to that squad's trends. The demo's second squad has one athlete whose pain waits for a physiotherapist.
test("the head coach's home says what to act on in each squad, as the trends table counts it", async ({ page }, info) => {
  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  const watch = (await (await page.request.get('/api/trends/watch')).json()) as {
    squads: { squadId: string; name: string; painWaiting: number; referred: number }[];
  };
  expect(watch.squads.length).toBeGreaterThan(0);
  await expect(page.getByTestId('squad-watch')).toBeVisible();
  for (const w of watch.squads) {
    const card = page.getByTestId(`squad-watch-${w.squadId}`);
    if (w.painWaiting) await expect(card).toContainText(`${w.painWaiting} with pain reported, waiting for a physiotherapist`);
    if (w.referred) await expect(card).toContainText(`${w.referred} referred on`);
    // The numbers are the trends table's.
    const trends = (await (await page.request.get(`/api/squads/${w.squadId}/trends`)).json()) as { athletes: { awaitingClearance: boolean }[] };
    expect(trends.athletes.filter((a) => a.awaitingClearance).length).toBe(w.painWaiting);
  }
  // A line opens the squad's table sorted to show who (the demo refers one athlete on).
  const withReferral = watch.squads.find((w) => w.referred > 0)!;
  await page
    .getByTestId(`squad-watch-${withReferral.squadId}`)
    .getByRole('link', { name: /referred on/ })
    .click();
  await expect(page).toHaveURL(new RegExp(`/trends\\?squad=${withReferral.squadId}&sort=clearance`));
  await expect(page.getByTestId('row-count')).toBeVisible();
  await page.goBack();
  const first = watch.squads[0]!;
  await page
    .getByTestId(`squad-watch-${first.squadId}`)
    .getByRole('link', { name: /trends and who/ })
    .click();
  await expect(page).toHaveURL(new RegExp(`/trends\\?squad=${first.squadId}`));
  await page.screenshot({ path: info.outputPath('trends-from-home.png') });
});
