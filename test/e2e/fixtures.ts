import { test as base, type Page } from '@playwright/test';

export { expect } from '@playwright/test';

/**
 * Waits until the app has taken the page over (`<html data-started>`, features/ui/app-started.web.ts).
 * A pre-rendered page is painted before its scripts run, and a click on it before then does nothing, as
 * for a person on a slow connection; a test acts once the app runs, as that person would by trying again.
 */
export async function waitForApp(page: Page): Promise<void> {
  await page.locator('html[data-started]').waitFor({ state: 'attached' });
}

/**
 * Playwright's `test`, whose `page` waits for the app after each full page load (`goto` and `reload`;
 * not with `waitUntil: 'commit'`, which a test uses to act on the page before the app starts). Pages a
 * test opens itself call `waitForApp` after loading.
 */
export const test = base.extend({
  page: async ({ page }, provide) => {
    const goto = page.goto.bind(page);
    const reload = page.reload.bind(page);
    page.goto = async (url, options) => {
      const res = await goto(url, options);
      if (options?.waitUntil !== 'commit') await waitForApp(page);
      return res;
    };
    page.reload = async (options) => {
      const res = await reload(options);
      if (options?.waitUntil !== 'commit') await waitForApp(page);
      return res;
    };
    await provide(page);
  },
});
