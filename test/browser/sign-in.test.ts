import { existsSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

/**
 * How loud each colour of the sign-in page's background is: its chroma (the largest less the smallest
 * of red, green and blue, 0 to 1) times its opacity, a plain measure of how far from grey it is.
 */
async function backgroundLoudness(): Promise<number[]> {
  return browser.page.locator('.page').evaluate((element) => {
    const style = getComputedStyle(element);
    const colours = `${style.backgroundColor} ${style.backgroundImage}`.match(/rgba?\([^)]*\)|color\(srgb [^)]*\)/g) ?? [];
    return colours.map((colour) => {
      const numbers = (colour.match(/-?[\d.]+/g) ?? []).map(Number);
      const scale = colour.startsWith('color(') ? 1 : 255;
      const [r = 0, g = 0, b = 0] = numbers.slice(0, 3).map((value) => value / scale);
      const alpha = colour.includes('/') || colour.startsWith('rgba') ? (numbers[3] ?? 1) : 1;
      return (Math.max(r, g, b) - Math.min(r, g, b)) * alpha;
    });
  });
}

describe('the sign-in page', () => {
  it('lies on a quiet background in the light and the dark scheme', async () => {
    const { page } = browser;
    for (const colorScheme of ['light', 'dark'] as const) {
      await page.emulateMedia({ colorScheme });
      await page.goto(`${served.baseUrl}/sign-in`);
      await page.getByLabel('E-mail').waitFor();
      const loudness = await backgroundLoudness();
      expect(loudness.length, colorScheme).toBeGreaterThan(0);
      // Near grey: a tint of at most 0.1 chroma at full opacity (common practice for a background under text).
      expect(Math.max(...loudness), colorScheme).toBeLessThan(0.1);
      await browser.screenshot(`sign-in-${colorScheme}`);
    }
    await page.emulateMedia({ colorScheme: 'light' });
  });
});

describe('signing in with a real browser', () => {
  it('sends a visitor to the sign-in page, and a wrong password gets the generic message', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toContain('The e-mail or password is not correct.');
    await browser.screenshot('sign-in-failed');
  });

  it('signs in as the demo engineer and shows the shell with the name and role', async () => {
    const { page } = browser;
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    const who = page.getByTestId('signed-in-user');
    await who.waitFor();
    expect(await who.textContent()).toContain('Ines Halvorsen');
    expect(await who.textContent()).toContain('Engineer');
    await page.getByText('Alder Bay Library & Makerspace').waitFor();
    const file = await browser.screenshot('shell-signed-in');
    expect(existsSync(file)).toBe(true);
  });

  it('keeps the session across a reload and ends it on sign-out', async () => {
    const { page } = browser;
    await page.reload();
    await page.getByTestId('signed-in-user').waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${served.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
  });
});
