import { expect, test } from './fixtures';
import { openNav, signIn } from './helpers';

// The training sheet as the demo tester: reached from the navigation, the demo squad's plans grouped by
// exercise (what the page shows is checked against the API's sheet for the same squad), an athlete's
// name opens their result, and the printed page keeps the sheet without its controls.

type Sheet = {
  squad: { id: string; name: string };
  athletes: { id: string; name: string; state: string; hold: string | null; rescreenDue: boolean }[];
  exercises: { id: string; name: string; entries: { athleteId: string; name: string; held: boolean }[] }[];
};

test('training sheet: a squad by exercise, holds first, names open results, printable', async ({ page }, info) => {
  test.slow();
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('menu-button').or(page.getByRole('navigation'))).toBeVisible();
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
  const holds = sheet.athletes.filter((a) => a.hold);
  if (holds.length) await expect(page.getByTestId('sheet-holds')).toContainText(holds[0]!.name);
  else await expect(page.getByTestId('sheet-holds')).toHaveCount(0);
  const due = sheet.athletes.filter((a) => a.state === 'plan' && a.rescreenDue);
  if (due.length) await expect(page.getByTestId('sheet-due')).toContainText(due.map((a) => a.name).join(', '));
  else await expect(page.getByTestId('sheet-due')).toHaveCount(0);

  await page.screenshot({ path: `test-results/training-sheet-${info.project.name}.png`, fullPage: true });
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByTestId('sheet-print')).toBeHidden();
  await page.screenshot({ path: `test-results/training-sheet-print-${info.project.name}.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  await expect(page.getByTestId('sheet-print')).toBeVisible();

  // A name opens that athlete's result, where the full plan and how to do each exercise are.
  const first = sheet.exercises[0]!.entries[0]!;
  await page.getByTestId(`sheet-entry-${sheet.exercises[0]!.id}-${first.athleteId}`).getByRole('link', { name: first.name }).click();
  await expect(page).toHaveURL(/\/screening\/assessments\/[^/]+\/result$/);
  await expect(page.getByRole('heading', { name: first.name, exact: true })).toBeVisible();
});
