import { type Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { signIn, tidyUp, uniqueSurname } from './helpers';

// A parent changes their own consent from their child's page: what it means is said before they confirm,
// the decision is dated today and carries their name. Own squad, child and parent per project, so the
// demo family (and the tests that count its children) is untouched.

async function tokenFromMailbox(page: Page, email: string): Promise<string> {
  let token: string | undefined;
  await expect(async () => {
    const mail = (await (await page.request.get('/api/dev/mailbox')).json()) as { messages: { to: string[]; text: string }[] };
    token = /accept-invite\?token=(\S+)/.exec(mail.messages.find((m) => m.to.includes(email))?.text ?? '')?.[1];
    expect(token).toBeTruthy();
  }).toPass({ timeout: 20_000 });
  return token!;
}

test('a parent stops and gives back photo consent from their child’s page', async ({ page }, testInfo) => {
  test.setTimeout(120_000);
  const project = testInfo.project.name;
  const stamp = Date.now();
  const surname = uniqueSurname('Marlow', project);
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  const me = (await (await page.request.get('/api/me')).json()) as { memberships: { clubId: string; clubName: string }[] };
  const clubId = me.memberships.find((m) => m.clubName === 'Harbourside Shuttle Club')!.clubId;
  const squad = await page.request.post('/api/squads', { data: { name: `Consent ${project} ${stamp}` } });
  expect(squad.status()).toBe(201);
  const squadId = ((await squad.json()) as { squad: { id: string } }).squad.id;
  const created = await page.request.post('/api/athletes', {
    data: { firstName: 'Ines', lastName: surname, dateOfBirth: '2014-03-09', sex: 'female', racketHand: 'right', takeOffLeg: 'left', squadId },
  });
  expect(created.status()).toBe(201);
  const athleteId = ((await created.json()) as { athlete: { id: string } }).athlete.id;
  const today = new Date().toISOString().slice(0, 10);
  expect((await page.request.post(`/api/athletes/${athleteId}/consents`, { data: { kind: 'photos', granted: true, decidedOn: today } })).status()).toBe(201);
  const email = `consent-${project}-${stamp}@squadline.test`;
  expect((await page.request.post(`/api/clubs/${clubId}/invitations`, { data: { email, role: 'parent', athleteIds: [athleteId] } })).status()).toBe(201);
  const token = await tokenFromMailbox(page, email);

  // The parent joins (the invitation links Ines) and opens her details from the home page.
  await page.context().clearCookies();
  const joined = await page.request.post('/api/auth/invitations/accept', { data: { token, displayName: 'Noor Marlow', password: 'a-very-long-password' } });
  expect(joined.status()).toBeLessThan(300);
  await page.goto('/');
  await expect(page.getByTestId('child-card')).toContainText('agreed, screening photos may be taken');
  await page.getByTestId('child-details-link').click();
  await expect(page.getByTestId('consent-photos')).toContainText('Photos may be taken');
  // How long photos are kept, in the club's months (the demo keeps the default 24).
  await expect(page.getByTestId('consent-photo-terms')).toHaveText("Photos are deleted 24 months after the screen (the club's retention period).");
  // Parents are not offered the staff form with its chosen date.
  await expect(page.getByTestId('consent-record')).toHaveCount(0);

  await page.getByTestId('own-consent-photos').click();
  await expect(page.getByTestId('own-consent-photos-confirm')).toContainText('Photos already taken are hidden at once and deleted 30 days later');
  await page.screenshot({ path: testInfo.outputPath('parent-stops-photos.png'), fullPage: true });
  await page.getByTestId('own-consent-photos-yes').click();
  await expect(page.getByTestId('consent-photos')).toContainText('No photos');
  await expect(page.getByTestId('consent-history')).toContainText('Photos: no');
  await expect(page.getByTestId('consent-history')).toContainText('Recorded by Noor Marlow');
  await expect(page.getByTestId('own-consent-photos')).toHaveText('Agree to photos of Ines');

  // The athlete record (what staff read too) has the withdrawal, dated today.
  const athlete = (await (await page.request.get(`/api/athletes/${athleteId}`)).json()) as { athlete: { consents: { photos: unknown } } };
  expect(athlete.athlete.consents.photos).toEqual({ granted: false, decidedOn: today });

  // Changing their mind, the other way round.
  await page.getByTestId('own-consent-photos').click();
  await page.getByTestId('own-consent-photos-yes').click();
  await expect(page.getByTestId('consent-photos')).toContainText('Photos may be taken');
  await page.goto('/');
  await expect(page.getByTestId('child-card')).toContainText('agreed, screening photos may be taken');
  await tidyUp(page, athleteId, squadId);
});

test('no screen without the family’s agreement: the tester is told, the parent agrees from the app', async ({ page }, testInfo) => {
  test.setTimeout(150_000);
  const project = testInfo.project.name;
  const stamp = Date.now();
  const surname = uniqueSurname('Quill', project);
  const today = new Date().toISOString().slice(0, 10);
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  const me = (await (await page.request.get('/api/me')).json()) as { memberships: { clubId: string; clubName: string }[] };
  const clubId = me.memberships.find((m) => m.clubName === 'Harbourside Shuttle Club')!.clubId;
  const squadId = ((await (await page.request.post('/api/squads', { data: { name: `Taking part ${project} ${stamp}` } })).json()) as { squad: { id: string } })
    .squad.id;
  const created = await page.request.post('/api/athletes', {
    data: { firstName: 'Wren', lastName: surname, dateOfBirth: '2014-06-02', sex: 'female', racketHand: 'right', takeOffLeg: 'left', squadId },
  });
  expect(created.status()).toBe(201);
  const athleteId = ((await created.json()) as { athlete: { id: string } }).athlete.id;
  const email = `taking-part-${project}-${stamp}@squadline.test`;
  expect((await page.request.post(`/api/clubs/${clubId}/invitations`, { data: { email, role: 'parent', athleteIds: [athleteId] } })).status()).toBe(201);
  const token = await tokenFromMailbox(page, email);

  // The tester opens a round of the squad: Wren is listed, marked, never "next", and her screen says why not.
  await page.context().clearCookies();
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  const opened = await page.request.post('/api/rounds', { data: { squadId, name: `Check ${stamp}`, screenedOn: today } });
  expect(opened.status()).toBe(201);
  const round = (await opened.json()) as { round: { id: string }; athletes: { assessmentId: string }[] };
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByTestId('round-not-taking-part')).toContainText(`Wren ${surname}`);
  await expect(page.getByTestId(`round-athlete-${athleteId}`)).toContainText('No screening consent yet: do not screen');
  await expect(page.getByTestId('screen-next')).toHaveCount(0);
  await expect(page.getByText('Everyone is screened')).toHaveCount(0);
  await page.screenshot({ path: testInfo.outputPath('round-not-taking-part.png'), fullPage: true });
  await page.getByTestId(`round-athlete-${athleteId}`).click();
  await expect(page.getByTestId('capture-not-taking-part')).toContainText('nothing of this screen can be saved');
  await expect(page.getByTestId('step-next')).toHaveCount(0);

  // The parent joins: the home card and the family page say Wren is not screened, and where to change it.
  await page.context().clearCookies();
  const joined = await page.request.post('/api/auth/invitations/accept', { data: { token, displayName: 'Ash Quill', password: 'a-very-long-password' } });
  expect(joined.status()).toBeLessThan(300);
  await page.goto('/');
  await expect(page.getByTestId('child-card')).toContainText('Screens and exercises: not agreed yet (not screened)');
  await page.goto(`/family/${athleteId}`);
  await expect(page.getByTestId('family-not-taking-part')).toContainText('so Wren is not screened');
  await page.getByTestId('family-consent-link').click();
  await expect(page.getByTestId('consent-screening')).toContainText('Not recorded yet: not screened until it is');
  await page.getByTestId('own-consent-screening').click();
  await expect(page.getByTestId('own-consent-screening-confirm')).toContainText('with a coach watching');
  await page.getByTestId('own-consent-screening-yes').click();
  await expect(page.getByTestId('consent-screening')).toContainText('Takes part in screens and corrective exercises');
  await expect(page.getByTestId('consent-history')).toContainText('Screening and exercises: yes');

  // Back to the tester: Wren is next.
  await page.context().clearCookies();
  await signIn(page, 'tester@squadline.test');
  await expect(page.getByTestId('home-tester')).toBeVisible();
  await page.goto(`/screening/rounds/${round.round.id}`);
  await expect(page.getByTestId('screen-next')).toContainText(`Wren ${surname}`);
  await expect(page.getByTestId('round-not-taking-part')).toHaveCount(0);
  // Closed again so the demo club's open rounds do not grow with every run.
  expect((await page.request.post(`/api/rounds/${round.round.id}/close`)).status()).toBeLessThan(300);
  await tidyUp(page, athleteId, squadId);
});
