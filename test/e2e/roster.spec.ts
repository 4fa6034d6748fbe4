import { type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { signIn, uniqueSurname } from './helpers';

/** A date of birth that makes an athlete `years` (or `years` + 1) old today. */
function bornYearsAgo(years: number): string {
  return `${new Date().getUTCFullYear() - years - 1}-11-15`;
}

async function signInAsCoach(page: Page) {
  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
}

test('a head coach adds an athlete, records a photo consent and archives them', async ({ page }, testInfo) => {
  const lastName = uniqueSurname('Rost', testInfo.project.name);
  await signInAsCoach(page);
  await page.goto('/athletes');
  await page.getByTestId('add-athlete').click();
  await expect(page.getByRole('heading', { name: 'Add an athlete' })).toBeVisible();

  // Saving an empty form names each missing field beside it.
  await page.getByTestId('athlete-save').click();
  await expect(page.getByText('Enter the first name.')).toBeVisible();
  await expect(page.getByText('Choose a squad.')).toBeVisible();

  await page.getByTestId('athlete-first-name').fill('Runa');
  await page.getByTestId('athlete-last-name').fill(lastName);
  await page.getByTestId('athlete-date-of-birth').fill('2024-01-01');
  await page.getByTestId('athlete-date-of-birth').blur();
  await expect(page.getByText(/athletes here are 6 to 19 years old/)).toBeVisible();
  await page.getByTestId('athlete-date-of-birth').fill(bornYearsAgo(11));
  await page.getByTestId('sex-female').click();
  await page.getByTestId('racketHand-left').click();
  await page.getByTestId('takeOffLeg-right').click();
  await page.getByRole('radio', { name: 'Under-15 mixed' }).click();
  await page.getByTestId('athlete-save').click();

  await expect(page).toHaveURL(/\/athletes\/[0-9a-f-]{36}$/);
  await expect(page.getByRole('heading', { name: `Runa ${lastName}` })).toBeVisible();
  await expect(page.getByTestId('consent-photos')).toContainText('Not recorded yet');

  await page.getByTestId('consent-record').click();
  await page.getByTestId('consent-kind-photos').click();
  await page.getByTestId('consent-answer-yes').click();
  await page.getByTestId('consent-save').click();
  await expect(page.getByTestId('consent-photos')).toContainText('Photos may be taken');
  await expect(page.getByTestId('consent-history')).toContainText('Photos: yes');
  await expect(page.getByTestId('consent-history')).toContainText('Recorded by Dan Mercer');

  await page.getByTestId('athlete-archive').click();
  await expect(page.getByText(`Archive Runa ${lastName}?`)).toBeVisible();
  await page.getByTestId('athlete-archive-confirm').click();
  await expect(page.getByTestId('archived-tag')).toBeVisible();
  await expect(page.getByTestId('athlete-restore')).toBeVisible();

  // Gone from the roster, still there with "Show archived".
  await page.goto('/athletes');
  await expect(page.getByText('Maya Okafor')).toBeVisible();
  await expect(page.getByText(`Runa ${lastName}`)).toHaveCount(0);
  await page.getByTestId('show-archived').click();
  await expect(page.getByText(`Runa ${lastName}`)).toBeVisible();
});

test('a head coach imports a CSV: a line with an error first, then a clean file', async ({ page }, testInfo) => {
  const lastName = uniqueSurname('Rost', testInfo.project.name);
  const squadName = `Import check ${lastName}`;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'squadline-roster-'));
  const header = 'First_Name,Last_Name,Date_Of_Birth,Sex,Racket_Hand,Take_Off_Leg,Squad,Photo_Consent,Email_Summaries_Consent';
  const good = (dob: string) =>
    [header, `Alva,${lastName},${bornYearsAgo(12)},F,R,L,${squadName},yes,no`, `Bo,${lastName},${dob},m,left,right,${squadName},n,y`].join('\n');
  const withError = path.join(dir, 'roster-with-error.csv');
  const clean = path.join(dir, 'roster.csv');
  fs.writeFileSync(withError, good('09/03/2014'));
  fs.writeFileSync(clean, good(bornYearsAgo(10)));
  // Later in the season: Alva's family withdrew photo consent, and a new athlete joined.
  const update = path.join(dir, 'roster-update.csv');
  fs.writeFileSync(
    update,
    [header, `Alva,${lastName},${bornYearsAgo(12)},F,R,L,${squadName},no,no`, `Cy,${lastName},${bornYearsAgo(11)},M,R,R,${squadName},yes,yes`].join('\n'),
  );

  await signInAsCoach(page);
  // A squad of its own, so that the demo squads stay as they are.
  await page.goto('/athletes');
  await page.getByTestId('manage-squads').click();
  await page.getByTestId('squad-new-name').fill(squadName);
  await page.getByTestId('squad-new-save').click();
  await expect(page.getByTestId(`squad-row-${squadName}`)).toBeVisible();

  await page.goto('/athletes');
  await page.getByTestId('import-csv').click();
  await expect(page.getByTestId('roster-header-example')).toContainText('first_name,last_name,date_of_birth');

  await page.getByTestId('roster-file-input').setInputFiles(withError);
  await expect(page.getByTestId('import-summary')).toContainText('1 of 2 lines need attention');
  const problem = page.getByTestId('import-problem-line');
  await expect(problem).toHaveCount(1);
  await expect(problem).toContainText(`Line 3: Bo ${lastName}`);
  await expect(problem).toContainText('Date of birth: Write the date as YYYY-MM-DD');
  // The cell as the file has it, to find it in the spreadsheet.
  await expect(problem).toContainText('The file has “09/03/2014”.');
  await expect(page.getByTestId('import-commit')).toHaveCount(0);

  await page.getByTestId('roster-file-input').setInputFiles(clean);
  await expect(page.getByTestId('import-summary')).toContainText('All 2 lines are ready');
  await expect(page.getByTestId('import-problem-line')).toHaveCount(0);
  // Each new line says what it records: its consents (and a parent account, where the file names one).
  await expect(page.getByTestId('import-ready-totals')).toContainText('of 2; a parent account linked for 0 of 2.');
  await expect(page.getByTestId('import-ready-line').first()).toContainText('photo consent:');
  await page.getByTestId('import-commit').click();
  await expect(page.getByTestId('import-done')).toContainText('2 athletes imported');

  // The same child again is an update, shown with what changes before anything is written.
  await page.getByTestId('roster-file-input').setInputFiles(update);
  await expect(page.getByTestId('import-summary')).toContainText('All 2 lines are ready');
  const updates = page.getByTestId('import-update-line');
  await expect(updates).toHaveCount(1);
  await expect(updates).toContainText(`Line 2: Alva ${lastName}`);
  await expect(updates).toContainText('photo consent: yes → no');
  // A consent answer changed by the file stands out from the other changes.
  await expect(updates.getByTestId('import-consent-change')).toHaveText(/^⚠ photo consent: yes → no · consent answers dated today/);
  await expect(page.getByTestId('import-commit')).toHaveText('Import 1 new, update 1');
  await page.screenshot({ path: testInfo.outputPath('import-update-report.png'), fullPage: true });
  const before = await (await page.request.get('/api/athletes')).json();
  expect(before.athletes.filter((x: { lastName: string }) => x.lastName === lastName)).toHaveLength(2);
  await page.getByTestId('import-commit').click();
  await expect(page.getByTestId('import-done')).toContainText('1 new athlete imported, 1 updated');
  // Brought into view: the button sat under the report, at the foot of a phone's screen.
  await expect(page.getByTestId('import-done')).toBeInViewport();
  const after = await (await page.request.get('/api/athletes')).json();
  const ours = after.athletes.filter((x: { lastName: string }) => x.lastName === lastName);
  expect(ours).toHaveLength(3);
  expect(ours.find((x: { firstName: string }) => x.firstName === 'Alva').consents.photos.granted).toBe(false);

  await page.goto('/athletes');
  await expect(page.getByText(`Alva ${lastName}`)).toBeVisible();
  await expect(page.getByText(`Bo ${lastName}`)).toBeVisible();

  // Leave the demo club as it was: archive what this test added.
  const list = await (await page.request.get('/api/athletes')).json();
  for (const a of list.athletes.filter((x: { lastName: string }) => x.lastName === lastName)) {
    expect((await page.request.post(`/api/athletes/${a.id}/archive`)).status()).toBe(200);
  }
  // The emptied squad is archived from its row, after a confirmation.
  await page.goto('/athletes');
  await page.getByTestId('manage-squads').click();
  const row = page.getByTestId(`squad-row-${squadName}`);
  await row.getByRole('button', { name: `Archive ${squadName}` }).click();
  await expect(row).toContainText('its rounds and results are kept');
  await row.getByTestId('squad-archive-confirm').click();
  await expect(page.getByTestId(`squad-row-${squadName}`)).toHaveCount(0);
  fs.rmSync(dir, { recursive: true, force: true });
});

test("the admin's home leads to the athletes missing a family decision or a parent account, and only them", async ({ page }) => {
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  await page.getByTestId('consent-gaps-who').click();
  await expect(page.getByTestId('athletes-gaps-only')).toBeVisible();
  const rows = page.locator('a[data-testid^="athlete-"][href^="/athletes/"]');
  await expect(rows.first()).toBeVisible();
  const shown = await rows.count();
  // Each row shown says what is missing (other tests add athletes at the same time, so rows are read, not counted).
  for (let i = 0; i < shown; i++) await expect(rows.nth(i)).toContainText(/No parent linked|No photo decision yet|No screening consent yet/);
  await page.getByTestId('athletes-show-all').click();
  await expect(page.getByTestId('athletes-gaps-only')).toHaveCount(0);
  expect(await rows.count()).toBeGreaterThanOrEqual(shown);
});
