import { expect, type Page } from '@playwright/test';
import { waitForApp } from './fixtures';

export const DEMO_PASSWORD = 'squadline-demo';

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await waitForApp(page); // also for pages a test opens itself
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in-submit').click();
}

/** Opens the navigation on a phone (it is always visible on a wide screen). */
export async function openNav(page: Page) {
  const menu = page.getByTestId('menu-button');
  if (await menu.isVisible()) await menu.click();
  await expect(page.getByRole('navigation')).toBeVisible();
}

/**
 * A surname of letters only (names refuse digits), new on every run: both projects (phone and wide) run
 * at once against one database, and a rerun against the same database must not meet the first run's child.
 */
export function uniqueSurname(prefix: string, project: string): string {
  const letters = (n: number) => n.toString(26).replace(/./g, (c) => String.fromCharCode(97 + parseInt(c, 26)));
  const tag = letters(Date.now() % 26 ** 6) + letters(Math.floor(Math.random() * 26 ** 3));
  return `${prefix}${project === 'phone' ? 'p' : 'w'}${tag}`;
}

/** A test's own athlete and squad archived again (as the admin), so the demo club's lists do not grow with every run. */
export async function tidyUp(page: Page, athleteId: string, squadId: string) {
  await page.context().clearCookies();
  await signIn(page, 'admin@squadline.test');
  await expect(page.getByTestId('home-admin')).toBeVisible();
  expect((await page.request.post(`/api/athletes/${athleteId}/archive`)).status()).toBe(200);
  expect((await page.request.post(`/api/squads/${squadId}/archive`)).status()).toBe(200);
}
