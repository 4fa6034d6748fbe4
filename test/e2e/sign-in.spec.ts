import { expect, test, waitForApp } from './fixtures';
import { openNav, signIn } from './helpers';

// Whether the app has taken the sign-in page over: its e-mail field is one React made.
const appOwns = () => Object.keys(document.querySelector('[data-testid="email"]') ?? {}).some((k) => k.startsWith('__reactFiber'));

const ROLES = [
  { email: 'admin@squadline.test', role: 'admin', heading: 'Club set-up' },
  { email: 'coach@squadline.test', role: 'head_coach', heading: 'Squad overview' },
  { email: 'tester@squadline.test', role: 'tester', heading: 'Courtside' },
  { email: 'physio@squadline.test', role: 'physio', heading: 'Athlete review' },
  { email: 'parent@squadline.test', role: 'parent', heading: 'Your family' },
] as const;

for (const { email, role, heading } of ROLES) {
  test(`${role} signs in and sees their home`, async ({ page }) => {
    await signIn(page, email);
    await expect(page.getByTestId(`home-${role}`)).toBeVisible();
    await expect(page.getByRole('heading', { name: heading })).toBeVisible();
    if (role === 'parent') {
      await expect(page.getByTestId('child-card')).toHaveCount(2);
      await expect(page.getByText('Maya Okafor')).toBeVisible();
    } else {
      await expect(page.getByText('Under-13 mixed', { exact: true }).first()).toBeVisible();
    }
    // Signing out returns to sign-in, and the home is then out of reach.
    await openNav(page);
    await page.getByTestId('sign-out').click();
    await expect(page).toHaveURL(/\/sign-in$/);
    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in$/);
  });
}

test('a wrong password shows a clear error and stays on sign-in', async ({ page }) => {
  await signIn(page, 'tester@squadline.test', 'not-the-password');
  await expect(page.getByTestId('sign-in-error')).toContainText('do not match');
  await expect(page).toHaveURL(/\/sign-in$/);
});

test('empty fields are named beside the fields', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByText('Enter your e-mail address.')).toBeVisible();
  await expect(page.getByText('Enter your password.')).toBeVisible();
});

test('what is typed before the app has started is kept (a slow connection: the form is painted first)', async ({ page }) => {
  // The app's main chunk is held until both fields are filled in on the pre-rendered page.
  let release = () => {};
  const held = new Promise<void>((resolve) => (release = resolve));
  await page.route('**/_expo/static/js/web/entry-*.js', async (route) => {
    await held;
    await route.continue();
  });
  await page.goto('/sign-in', { waitUntil: 'commit' });
  await page.getByTestId('email').fill('tester@squadline.test');
  await page.getByTestId('password').fill('squadline-demo');
  expect(await page.evaluate(appOwns)).toBe(false);
  release();
  await page.waitForFunction(appOwns);
  await expect(page.getByTestId('email')).toHaveValue('tester@squadline.test');
  // The app's page replaces the pre-rendered one: the field typed in last keeps the focus and its text.
  await expect(page.getByTestId('password')).toBeFocused();
  await expect(page.getByTestId('password')).toHaveValue('squadline-demo');
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('home-tester')).toBeVisible();
});

test('the app renders the page afresh: one commit replaces the pre-rendered page, drawn the same', async ({ page }) => {
  // Hydration forced a synchronous render of the whole page (one long task); the export's flag is out.
  const html = await (await page.request.get('/sign-in')).text();
  expect(html).toContain('data-start=');
  expect(html).not.toContain('__EXPO_ROUTER_HYDRATE__');
  // The pre-rendered page alone (the app's scripts refused), then the app's page: the same layout.
  await page.route('**/_expo/static/js/web/**', (route) => route.abort());
  await page.goto('/sign-in', { waitUntil: 'commit' });
  await expect(page.getByTestId('email')).toBeVisible();
  const boxes = async () => ({
    title: await page.getByRole('heading', { level: 1 }).first().boundingBox(),
    field: await page.getByTestId('email').boundingBox(),
  });
  const pre = await boxes();
  expect(await page.evaluate(appOwns)).toBe(false);
  await page.unroute('**/_expo/static/js/web/**');
  await page.goto('/sign-in');
  expect(await page.evaluate(appOwns)).toBe(true);
  expect(await boxes()).toEqual(pre);
  await page.getByTestId('email').fill('tester@squadline.test');
  await page.getByTestId('password').fill('squadline-demo');
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('home-tester')).toBeVisible();
});

test('the first visit is drawn in the system face; the font files are fetched when idle and used from the next visit', async ({ page }) => {
  const rules = () => {
    const style = document.getElementById('expo-generated-fonts');
    return style ? (style.getAttribute('media') ?? 'all') : 'missing';
  };
  await page.goto('/sign-in');
  expect(await page.evaluate(rules)).toBe('not all');
  await expect.poll(async () => (await page.context().cookies()).find((c) => c.name === 'squadline_fonts')?.value).toBe('1');
  expect(await page.evaluate(rules)).toBe('not all'); // nothing changes face during the visit
  await page.reload();
  expect(await page.evaluate(rules)).toBe('all');
  await page.waitForFunction(() => document.fonts.check('18px SquadlineSans_400Regular'));
});

test('the manifest and the tab icon are linked after the first paint, so nothing fetches them before it', async ({ page, request }) => {
  // Chromium fetches the tab icon itself (no page event): watched through the DevTools protocol.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  const asked: { url: string; at: number }[] = [];
  cdp.on('Network.requestWillBeSent', (e) => asked.push({ url: e.request.url, at: e.wallTime * 1000 }));
  const served = await (await request.get('/sign-in')).text();
  expect(served).not.toContain('<link rel="manifest"');
  expect(served).toContain('<link rel="icon" href="data:,">');

  await page.goto('/sign-in');
  await expect(page.locator('link[rel="manifest"]')).toHaveAttribute('href', '/manifest.webmanifest');
  await expect.poll(() => asked.some((r) => r.url.endsWith('/icons/icon-192.png'))).toBe(true);
  const paint = await page.evaluate(() => performance.timeOrigin + performance.getEntriesByName('first-contentful-paint')[0]!.startTime);
  const early = asked.filter((r) => /\/(manifest\.webmanifest|icons\/.*|favicon\.ico)$/.test(r.url) && r.at <= paint);
  expect(early).toEqual([]);
  expect((await request.get('/manifest.webmanifest')).status()).toBe(200);
});

test('signed-out visits to signed-in pages redirect to sign-in, which then opens the page asked for', async ({ page }) => {
  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in$/);
  for (const path of ['/athletes', '/people', '/dev/mailbox']) {
    await page.goto(path);
    await expect(page).toHaveURL(new RegExp(`/sign-in\\?next=${encodeURIComponent(path)}$`));
  }
  // A link in an e-mail (here the athletes list) opened signed out: after signing in, that page, not home.
  await page.goto('/athletes');
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await page.getByTestId('email').fill('coach@squadline.test');
  await page.getByTestId('password').fill('squadline-demo');
  await page.getByTestId('sign-in-submit').click();
  await expect(page).toHaveURL(/\/athletes$/);
  await expect(page.getByRole('heading', { name: 'Athletes' })).toBeVisible();
});

test('a next address pointing off the app goes home after sign-in', async ({ page }) => {
  await page.goto('/sign-in?next=' + encodeURIComponent('//evil.test/x'));
  await page.getByTestId('email').fill('coach@squadline.test');
  await page.getByTestId('password').fill('squadline-demo');
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('home-head_coach')).toBeVisible();
  await expect(page).toHaveURL(/:\d+\/$/);
});

test("a parent cannot open another family's athlete", async ({ page, request }) => {
  // Find another family's athlete as staff, then try it as the parent.
  await request.post('/api/auth/sign-in', { data: { email: 'coach@squadline.test', password: 'squadline-demo' } });
  const list = await (await request.get('/api/athletes')).json();
  const stranger = list.athletes.find((a: { lastName: string }) => a.lastName !== 'Okafor');
  await signIn(page, 'parent@squadline.test');
  await expect(page.getByTestId('home-parent')).toBeVisible();
  await page.goto(`/athletes/${stranger.id}`);
  await expect(page.getByText('You can only see the athletes linked to you.')).toBeVisible();
  // The staff's roster is not a parent's page: it says so and leads home.
  await page.goto('/athletes');
  await expect(page.getByTestId('roster-staff-only')).toContainText('your home page');
  await expect(page.getByTestId('show-archived')).toHaveCount(0);
});

test('an admin invites someone and the e-mail arrives in the local mailbox', async ({ page }) => {
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  await openNav(page);
  await page.getByRole('link', { name: 'People' }).click();
  const email = `new-tester-${Date.now()}@squadline.test`;
  await page.getByTestId('invite-email').fill(email);
  // No role is chosen in advance (our choice): sent without one, the form asks for it.
  await page.getByTestId('invite-submit').click();
  await expect(page.getByText('Choose a role.')).toBeVisible();
  await page.getByRole('radio', { name: 'Tester' }).click();
  await page.getByTestId('invite-submit').click();
  await page.getByTestId('invite-send-confirm').click();
  await expect(page.getByText('Invitation sent.')).toBeVisible();
  await openNav(page);
  await page.getByRole('link', { name: 'Mailbox (local)' }).click();
  const message = page.getByTestId('mail-message').filter({ hasText: email });
  await expect(message).toBeVisible({ timeout: 20_000 });
  const text = await message.innerText();
  const link = /(http\S+accept-invite\?token=\S+)/.exec(text)![1]!;

  // The invitee opens the link in a fresh browser and joins.
  const invitee = await page.context().browser()!.newContext({ viewport: page.viewportSize()! });
  const p2 = await invitee.newPage();
  await p2.goto(new URL(link).pathname + new URL(link).search);
  await waitForApp(p2);
  await p2.getByLabel('Your name').fill('Nia Newcomer');
  await p2.getByLabel('Choose a password').fill('a-very-long-password');
  await p2.getByRole('button', { name: 'Join the club' }).click();
  await expect(p2.getByTestId('home-tester')).toBeVisible();

  // Signed in on a second device too; changing the password from "Your account" ends that session
  // and keeps this one.
  const laptop = await page.context().browser()!.newContext();
  expect((await laptop.request.post(new URL('/api/auth/sign-in', link).href, { data: { email, password: 'a-very-long-password' } })).status()).toBe(200);
  await openNav(p2);
  await p2.getByTestId('account-link').click();
  await expect(p2.getByTestId('account-details')).toContainText(email);
  await expect(p2.getByTestId('account-details')).toContainText('Tester at');
  await p2.getByTestId('current-password').fill('not-the-password');
  await p2.getByTestId('new-password').fill('another-long-password');
  await p2.getByTestId('change-password').click();
  await expect(p2.getByText('This is not your current password.')).toBeVisible();
  await p2.getByTestId('current-password').fill('a-very-long-password');
  await p2.getByTestId('change-password').click();
  await expect(p2.getByTestId('password-changed')).toBeVisible();
  expect((await laptop.request.get(new URL('/api/me', link).href)).status()).toBe(401);
  expect((await p2.request.get('/api/me')).status()).toBe(200);
  await laptop.close();
  await invitee.close();
});
