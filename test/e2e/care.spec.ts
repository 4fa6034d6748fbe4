import { expect, test } from '@playwright/test';
import path from 'node:path';
import { openNav, signIn } from './helpers';

// Both projects run at once against one demo database: each takes a different screen from the review list.
const shots = (name: string, project: string) => path.join(__dirname, '..', '..', 'test-results', 'care', `${name}-${project}.png`);

test('a physiotherapist reviews a screen, adds a note, previews the family e-mail and releases it', async ({ page }, testInfo) => {
  await signIn(page, 'physio@squadline.test');
  await expect(page.getByTestId('home-physio')).toBeVisible();
  await page.getByTestId('open-reviews').click();
  const rows = page.getByTestId('review-list').locator('a');
  await expect(rows.first()).toBeVisible();
  const before = await rows.count();
  expect(before).toBeGreaterThan(2);
  await page.screenshot({ path: shots('review-list', testInfo.project.name), fullPage: true });

  await rows.nth(testInfo.project.name === 'phone' ? 0 : 1).click();
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.getByTestId('review-state')).toContainText('Not reviewed yet');

  await page.getByTestId('note-text').fill('Watch the right knee on landings; re-check in six weeks.');
  await page.getByTestId('note-visibility').getByRole('radio', { name: 'Team only' }).click();
  await page.getByTestId('note-add').click();
  await expect(page.getByTestId('note').filter({ hasText: 'Watch the right knee on landings' })).toBeVisible();

  await page.getByTestId('mark-reviewed').click();
  await expect(page.getByTestId('review-state')).toContainText('Reviewed by Sam Adeyemi');

  await page.getByTestId('release-preview').click();
  await expect(page.getByTestId('email-preview')).toContainText(/what .* will work on/i);
  await page.getByTestId('result-care').screenshot({ path: shots('release-preview', testInfo.project.name) });
  await page.getByTestId('release-confirm').click();
  await expect(page.getByText(/The summary is in the family view/)).toBeVisible();
});

test('the summary e-mail renders as HTML without images', async ({ page }, testInfo) => {
  await signIn(page, 'physio@squadline.test');
  await expect(page.getByTestId('home-physio')).toBeVisible();
  const reviews = await page.request.get('/api/reviews');
  const list = (await reviews.json()) as { reviews: { assessmentId: string }[]; awaitingRelease: { assessmentId: string }[] };
  const any = list.awaitingRelease[0] ?? list.reviews[0];
  expect(any).toBeTruthy();
  const res = await page.request.get(`/api/assessments/${any!.assessmentId}/release-preview`);
  expect(res.status()).toBe(200);
  const { preview } = (await res.json()) as { preview: { html: string } };
  expect(preview.html).not.toMatch(/<img/i);
  await page.setContent(preview.html);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('movement screen');
  await expect(page.getByRole('link', { name: 'Stop these e-mails' })).toBeVisible();
  await page.screenshot({ path: shots('summary-email', testInfo.project.name), fullPage: true });
});

test("a parent reads their child's summary in plain words, with the plan and family notes", async ({ page }, testInfo) => {
  await signIn(page, 'parent@squadline.test');
  await expect(page.getByTestId('home-parent')).toBeVisible();
  await page.getByTestId('child-summary-link').first().click();
  await expect(page.getByTestId('family-view')).toBeVisible();
  await expect(page.getByTestId('family-summary')).toContainText('What was checked');
  await expect(page.getByTestId('family-summary')).toContainText('not a diagnosis');
  await expect(page.getByTestId('family-plan')).toBeVisible();
  let exercises = await page.getByTestId('family-exercise').count();
  await expect(page.getByTestId('family-earlier')).toBeVisible();
  // Two released screens: the later one compared with the one before, in family wording (no angles, no degrees).
  const comparison = page.getByTestId('family-comparison');
  await expect(comparison).toBeVisible();
  await expect(comparison).toContainText('Since the check before');
  await expect(comparison).toContainText('not a medical diagnosis');
  await expect(comparison).not.toContainText(/°|degree|angle|valgus/i);
  await comparison.screenshot({ path: shots('family-comparison', testInfo.project.name) });
  // No angles or measurements anywhere on the page.
  await expect(page.getByTestId('family-view')).not.toContainText('°');
  await page.screenshot({ path: shots('family-view', testInfo.project.name), fullPage: true });
  // Maya's page has the shared note; the team-only one never reaches the family.
  await page.goto('/');
  await page.getByTestId('child-card').filter({ hasText: 'Maya' }).getByTestId('child-summary-link').click();
  await expect(page.getByTestId('family-notes')).toContainText('Keep the ankle exercises going');
  await expect(page.getByTestId('family-notes')).not.toContainText('heel soreness');
  // Between the two children there is a plan with exercises and their how-to.
  await page.goto('/');
  await page.getByTestId('child-card').filter({ hasText: 'Theo' }).getByTestId('child-summary-link').click();
  await expect(page.getByTestId('family-plan')).toBeVisible();
  exercises += await page.getByTestId('family-exercise').count();
  expect(exercises).toBeGreaterThan(0);
  await page.screenshot({ path: shots('family-view-theo', testInfo.project.name), fullPage: true });
});

test('an admin reads the audit trail, filters it and exports it as CSV', async ({ page }, testInfo) => {
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  await openNav(page);
  await page.getByRole('navigation').getByText('Audit trail').click();
  await expect(page.getByTestId('audit-trail')).toBeVisible();
  await expect(page.getByTestId('audit-row').first()).toBeVisible();
  await page.getByTestId('audit-subject').getByRole('radio', { name: 'Clearance' }).click();
  await expect(page.getByTestId('audit-row').first()).toContainText('clearance');
  const rows = page.getByTestId('audit-row');
  for (let i = 0; i < Math.min(await rows.count(), 5); i++) await expect(rows.nth(i)).toContainText('clearance');
  await page.screenshot({ path: shots('audit', testInfo.project.name), fullPage: false });
  const csv = await page.request.get('/api/audit?format=csv&subject=clearance');
  expect(csv.headers()['content-type']).toContain('text/csv');
  const lines = (await csv.text()).trim().split('\n');
  expect(lines[0]).toBe('time,person,action,record,record id,athlete,details');
  expect(lines.length).toBeGreaterThan(1);
});
