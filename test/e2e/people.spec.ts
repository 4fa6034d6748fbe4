import { type Browser, type Page } from '@playwright/test';
import { expect, test, waitForApp } from './fixtures';
import { openNav, signIn } from './helpers';

// Parents: an invitation that names the children it links, and a parent with no linked child told what
// to do next. Then every main screen: one main landmark, one top-level heading, a title of its own.

test.use({ actionTimeout: 30_000 });

async function linkFromMailbox(page: Page, email: string): Promise<string> {
  let link: string | undefined;
  await expect(async () => {
    const mail = (await (await page.request.get('/api/dev/mailbox')).json()) as { messages: { to: string[]; subject: string; text: string }[] };
    const message = mail.messages.find((m) => m.to.includes(email));
    link = message ? /(http\S+accept-invite\?token=\S+)/.exec(message.text)?.[1] : undefined;
    expect(link).toBeTruthy();
  }).toPass({ timeout: 20_000 });
  return link!;
}

async function join(browser: Browser, page: Page, link: string, name: string) {
  const context = await browser.newContext({ viewport: page.viewportSize()! });
  const p2 = await context.newPage();
  await p2.goto(new URL(link).pathname + new URL(link).search);
  await waitForApp(p2);
  return {
    context,
    p2,
    joinWith: async () => {
      await p2.getByLabel('Your name').fill(name);
      await p2.getByLabel('Choose a password').fill('a-very-long-password');
      await p2.getByRole('button', { name: 'Join the club' }).click();
    },
  };
}

test('an invitation names the children it links; a parent without a linked child is told what to do', async ({ page, browser }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();

  // With a child: chosen by name on the People page.
  await openNav(page);
  await page.getByRole('link', { name: 'People' }).click();
  const withChild = `parent-${testInfo.project.name}-${Date.now()}@squadline.test`;
  await page.getByTestId('invite-email').fill(withChild);
  await page.getByRole('radio', { name: 'Parent or guardian' }).click();
  // Before a child is chosen the form says what that would mean; choosing one clears it.
  await expect(page.getByTestId('invite-no-child')).toContainText('the parent will see nothing');
  await page.getByTestId('invite-child-filter').fill('Maya');
  await page
    .getByTestId('invite-children')
    .getByText(/Maya Okafor/)
    .click();
  await expect(page.getByTestId('invite-children')).toContainText('✓ Maya Okafor');
  await expect(page.getByTestId('invite-no-child')).toHaveCount(0);
  await page.screenshot({ path: testInfo.outputPath('invite-parent.png'), fullPage: true });
  await page.getByTestId('invite-submit').click();
  // The e-mail names the child: the address is checked first.
  await expect(page.getByText(`The e-mail to ${withChild} names Maya Okafor.`)).toBeVisible();
  await page.getByTestId('invite-send-confirm').click();
  await expect(page.getByText('Invitation sent.')).toBeVisible();
  await expect(page.getByTestId('pending-invite').filter({ hasText: withChild })).toContainText('Parent or guardian of Maya Okafor');
  const link = await linkFromMailbox(page, withChild);
  const first = await join(browser, page, link, 'Ola Parent');
  await expect(first.p2.getByText('to follow Maya Okafor as their parent or guardian')).toBeVisible();
  await first.joinWith();
  await expect(first.p2.getByTestId('home-parent')).toBeVisible();
  await expect(first.p2.getByTestId('child-card')).toHaveCount(1);
  await expect(first.p2.getByTestId('child-card')).toContainText('Maya Okafor');
  await first.context.close();

  // Without a child: the home page says what to do next.
  const me = (await (await page.request.get('/api/me')).json()) as { memberships: { clubId: string; clubName: string }[] };
  const club = me.memberships.find((m) => m.clubName === 'Harbourside Shuttle Club')!;
  const alone = `parent-alone-${testInfo.project.name}-${Date.now()}@squadline.test`;
  expect((await page.request.post(`/api/clubs/${club.clubId}/invitations`, { data: { email: alone, role: 'parent' } })).status()).toBe(201);
  const second = await join(browser, page, await linkFromMailbox(page, alone), 'Sam Waiting');
  await second.joinWith();
  await expect(second.p2.getByTestId('parent-no-child')).toContainText('Ask the club');
  await second.p2.screenshot({ path: testInfo.outputPath('parent-no-child.png'), fullPage: true });
  await second.context.close();
});

test('an admin cancels an invitation and removes a member who left, each after a confirmation', async ({ page, browser }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  await openNav(page);
  await page.getByRole('link', { name: 'People' }).click();

  // An invitation sent to a wrong address: cancelled, its row goes; the form keeps the role chosen.
  const wrong = `wrong-${testInfo.project.name}-${Date.now()}@squadline.test`;
  await page.getByTestId('invite-email').fill(wrong);
  await page.getByRole('radio', { name: 'Physiotherapist' }).click();
  await page.getByTestId('invite-submit').click();
  // A staff role opens every child's records: said, and confirmed, before it goes.
  await expect(page.getByText(`${wrong} joins as a physiotherapist and can then open every squad's athletes`)).toBeVisible();
  await page.getByTestId('invite-send-confirm').click();
  await expect(page.getByText('Invitation sent.')).toBeVisible();
  await expect(page.getByRole('radio', { name: 'Physiotherapist' })).toBeChecked();
  const row = page.getByTestId('pending-invite').filter({ hasText: wrong });
  await expect(row).toContainText('Physiotherapist');
  await row.getByTestId('invite-cancel').click();
  await row.getByTestId('invite-cancel-confirm').click();
  await expect(page.getByTestId('pending-invite').filter({ hasText: wrong })).toHaveCount(0);

  // A tester who joined, then left the club: removed, after saying what that does.
  const me = (await (await page.request.get('/api/me')).json()) as { memberships: { clubId: string; clubName: string }[] };
  const club = me.memberships.find((m) => m.clubName === 'Harbourside Shuttle Club')!;
  const leaving = `leaving-${testInfo.project.name}-${Date.now()}@squadline.test`;
  expect((await page.request.post(`/api/clubs/${club.clubId}/invitations`, { data: { email: leaving, role: 'tester' } })).status()).toBe(201);
  const name = `Lee Leaving ${testInfo.project.name}`;
  const joined = await join(browser, page, await linkFromMailbox(page, leaving), name);
  await joined.joinWith();
  await expect(joined.p2.getByTestId('home-tester')).toBeVisible();
  await page.reload();
  const member = page.locator('[data-testid^="member-"]').filter({ hasText: name });
  // A change of role says what it does before it is saved, and cannot be saved unchanged.
  await member.getByTestId('member-change-role').click();
  await expect(member.getByTestId('member-role-save')).toBeDisabled();
  await member.getByTestId('member-role-physio').click();
  await expect(member.getByTestId('member-role-effect')).toContainText(`${name} becomes a physiotherapist at once`);
  await member.getByRole('button', { name: 'Cancel' }).click();
  await member.getByTestId('member-remove').click();
  await expect(member).toContainText('They lose access at once');
  await page.screenshot({ path: testInfo.outputPath('remove-member.png'), fullPage: true });
  await member.getByTestId('member-remove-confirm').click();
  await expect(page.locator('[data-testid^="member-"]').filter({ hasText: name })).toHaveCount(0);
  // Their next page finds no club any more.
  await joined.p2.reload();
  await expect(joined.p2.getByTestId('home-tester')).toHaveCount(0);
  await joined.context.close();
});

test('every main screen has one main landmark, one top-level heading and its own title', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, 'coach@squadline.test');
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  const rounds = (await (await page.request.get('/api/rounds')).json()) as { rounds: { id: string; name: string }[] };
  const athletes = (await (await page.request.get('/api/athletes')).json()) as { athletes: { id: string; firstName: string; lastName: string }[] };
  const pages: [string, string][] = [
    ['/', 'Home · Squadline'],
    ['/athletes', 'Athletes · Squadline'],
    ['/screening', 'Screening · Squadline'],
    ['/measuring', 'To measure · Squadline'],
    ['/people', 'People · Squadline'],
    ['/squads', 'Squads · Squadline'],
    [`/screening/rounds/${rounds.rounds[0]!.id}`, `${rounds.rounds[0]!.name} · Squadline`],
    [`/athletes/${athletes.athletes[0]!.id}`, `${athletes.athletes[0]!.firstName} ${athletes.athletes[0]!.lastName} · Squadline`],
  ];
  for (const [path, title] of pages) {
    await page.goto(path);
    await expect(page).toHaveTitle(title);
    await expect(page.getByRole('main'), path).toHaveCount(1);
    await expect(page.locator('h1'), path).toHaveCount(1);
  }
  await page.context().clearCookies();
  await page.goto('/sign-in');
  await expect(page).toHaveTitle(/Squadline/);
  await expect(page.getByRole('main')).toHaveCount(1);
  await expect(page.locator('h1')).toHaveCount(1);
});
