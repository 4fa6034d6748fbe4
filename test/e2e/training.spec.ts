import { expect, test } from './fixtures';
import { openNav, signIn } from './helpers';

// The training sheet as the demo tester: reached from the navigation, the demo squad's plans grouped by
// exercise (what the page shows is checked against the API's sheet for the same squad), who took part
// in a session recorded from it, an athlete's name opens their result, and the printed page keeps the
// sheet without its controls.

type Sheet = {
  squad: { id: string; name: string };
  athletes: { id: string; name: string; state: string; hold: string | null; physioChanges: string | null; rescreenDue: boolean }[];
  exercises: { id: string; name: string; entries: { athleteId: string; name: string; held: boolean }[] }[];
};

test('training sheet: a squad by exercise, holds first, names open results, printable', async ({ page }, info) => {
  test.slow();
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('menu-button').or(page.getByRole('navigation'))).toBeVisible();
  // The home's squad card says when the squad last had a corrective session (the demo records a season)
  // and leads to the squad's sheet.
  const u13 = await page.evaluate(
    async () => ((await (await fetch('/api/squads')).json()) as { squads: { id: string; name: string }[] }).squads.find((s) => s.name === 'Under-13 mixed')!,
  );
  const last = page.getByTestId(`squad-last-session-${u13.id}`);
  await expect(last).toContainText(/Last corrective session .+ · \d+ took part/);
  await expect(last.getByRole('link', { name: 'Training sheet →' })).toHaveAttribute('href', `/training?squad=${u13.id}`);
  await openNav(page);
  await page.getByRole('navigation').getByRole('link', { name: 'Training sheet' }).click();
  await expect(page.getByTestId('training-sheet')).toBeVisible();

  // The demo squad (other tests add squads of their own, which may sort first).
  await page.getByTestId('sheet-squad').getByText('Under-13 mixed', { exact: true }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Training sheet: Under-13 mixed');
  await expect(page.getByTestId('sheet-count')).toBeVisible();

  const sheet: Sheet = await page.evaluate(async (name) => {
    const squads = (await (await fetch('/api/squads')).json()) as { squads: { id: string; name: string }[] };
    const id = squads.squads.find((s) => s.name === name)!.id;
    return (await (await fetch(`/api/squads/${id}/training-sheet`)).json()) as never;
  }, 'Under-13 mixed');
  await expect(page).toHaveURL(new RegExp(`[?&]squad=${sheet.squad.id}`));
  expect(sheet.exercises.length).toBeGreaterThan(0);

  // One card per exercise, each with its athletes, as the API groups them.
  await expect(page.locator('[data-testid^="sheet-exercise-"]')).toHaveCount(sheet.exercises.length);
  for (const e of sheet.exercises) {
    const card = page.getByTestId(`sheet-exercise-${e.id}`);
    await expect(
      card
        .getByRole('heading')
        .or(card.getByText(e.name, { exact: true }))
        .first(),
    ).toBeVisible();
    await expect(card.locator('[data-testid^="sheet-entry-"]')).toHaveCount(e.entries.length);
  }
  const withPlan = sheet.athletes.filter((a) => a.state === 'plan').length;
  await expect(page.getByTestId('sheet-count')).toContainText(`${withPlan} of ${sheet.athletes.length}`);
  // The physiotherapist's changes: their words once at the top, a mark under the name at each of the
  // athlete's exercises.
  const changed = sheet.athletes.find((a) => a.physioChanges);
  if (changed) {
    await expect(page.getByTestId('sheet-physio-changes')).toContainText(changed.physioChanges!);
    const lines = page.locator(`[data-testid$="-${changed.id}"]`).getByTestId('sheet-physio-line');
    await expect(lines.first()).toContainText('check the top of the sheet');
    await expect(lines.first()).not.toContainText(changed.physioChanges!);
    expect(await lines.count()).toBe(sheet.exercises.filter((e) => e.entries.some((x) => x.athleteId === changed.id && !x.held)).length);
  }
  const holds = sheet.athletes.filter((a) => a.hold);
  if (holds.length) await expect(page.getByTestId('sheet-holds')).toContainText(holds[0]!.name);
  else await expect(page.getByTestId('sheet-holds')).toHaveCount(0);
  // Everyone due, on the sheet or not, and those never screened apart.
  const due = sheet.athletes.filter((a) => a.state !== 'no-screen' && a.rescreenDue);
  const never = sheet.athletes.filter((a) => a.state === 'no-screen');
  if (due.length) await expect(page.getByTestId('sheet-due')).toContainText(`Due a re-screen: ${due.map((a) => a.name).join(', ')}.`);
  if (never.length) await expect(page.getByTestId('sheet-due')).toContainText(`Not screened yet: ${never.map((a) => a.name).join(', ')}.`);
  if (!due.length && !never.length) await expect(page.getByTestId('sheet-due')).toHaveCount(0);

  await page.screenshot({ path: `test-results/training-sheet-${info.project.name}.png`, fullPage: true });
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByTestId('sheet-print')).toBeHidden();
  // Printed from the page's left edge across its width, not beside the side navigation.
  const printed = (await page.getByTestId('training-sheet').boundingBox())!;
  expect(printed.x).toBe(0);
  expect(printed.width).toBeGreaterThan((page.viewportSize()!.width * 9) / 10);
  await page.screenshot({ path: `test-results/training-sheet-print-${info.project.name}.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  await expect(page.getByTestId('sheet-print')).toBeVisible();

  // Record who took part: everyone with a plan is ticked to start with; untick one and save. The two
  // projects run at once on the same squad, so each records its own day (today, yesterday).
  await page.getByTestId('sheet-record-open').click();
  const form = page.getByTestId('sheet-record-form');
  await expect(form).toBeVisible();
  const dayIndex = info.project.name === 'phone' ? 1 : 0;
  await form.getByTestId('sheet-record-day').getByRole('radio').nth(dayIndex).click();
  const withPlanIds = sheet.athletes.filter((a) => a.state === 'plan').map((a) => a.id);
  const left = withPlanIds[0]!;
  // A day recorded by an earlier run starts from that record: tick everyone with a plan, then untick one.
  await form.getByRole('button', { name: 'Untick all' }).click();
  for (const id of withPlanIds) await form.getByTestId(`sheet-tick-${id}`).click();
  await form.getByTestId(`sheet-tick-${left}`).click();
  await expect(form.getByTestId(`sheet-tick-${left}`)).toHaveAttribute('aria-checked', 'false');
  await form.getByTestId('sheet-record-note').fill('Bands and balance, low box landings.');
  await form.getByTestId('sheet-record-save').click();
  await expect(page.getByTestId('sheet-recorded')).toContainText(`${withPlanIds.length - 1} athletes on`);
  const sessions: { heldOn: string; athleteIds: string[]; note: string }[] = await page.evaluate(
    async (id) => ((await (await fetch(`/api/squads/${id}/training-sessions`)).json()) as { sessions: never[] }).sessions,
    sheet.squad.id,
  );
  const recorded = sessions.find((x) => x.note === 'Bands and balance, low box landings.' && x.athleteIds.length === withPlanIds.length - 1);
  expect(recorded, JSON.stringify(sessions)).toBeTruthy();
  expect(recorded!.athleteIds).not.toContain(left);
  await page.screenshot({ path: `test-results/training-recorded-${info.project.name}.png` });

  // A day further back is typed; half a day saves nothing (not even against today).
  await page.getByTestId('sheet-record-open').click();
  await form.getByTestId('sheet-record-day').getByRole('radio', { name: 'Another day' }).click();
  await form.getByTestId('sheet-record-other-day').fill('2026-11');
  await form.getByTestId('sheet-record-save').click();
  await expect(form).toContainText('Write the date as YYYY-MM-DD');
  // Said beside the button too, where the thumb is.
  await expect(form.getByTestId('sheet-record-not-saved')).toContainText('Not saved: Write the date as YYYY-MM-DD');
  // Still open with the error: a save would have closed it (the other project records on this squad at the
  // same time, so counting its sessions would not tell).
  await expect(form.getByTestId('sheet-record-other-day')).toBeVisible();
  await form.getByRole('button', { name: 'Cancel' }).click();

  // A name opens that athlete's result, where the full plan and how to do each exercise are.
  const first = sheet.exercises[0]!.entries[0]!;
  await page.getByTestId(`sheet-entry-${sheet.exercises[0]!.id}-${first.athleteId}`).getByRole('link', { name: first.name }).click();
  await expect(page).toHaveURL(/\/screening\/assessments\/[^/]+\/result$/);
  await expect(page.getByRole('heading', { name: first.name, exact: true })).toBeVisible();
});
