import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

/** Numeric fields read what people type on site; the demo project is in feet. */
let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl: string;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  projectUrl = await signInToDemo({ browser, served }, 'engineer@alderbay.example', inject('demoPassword'));
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('numeric fields take expressions with units', () => {
  it('reads feet and inches, metres and arithmetic in the space editor, and says what to write when it cannot', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await page
      .getByRole('button', { name: /^Edit / })
      .first()
      .click();
    const editor = page.getByRole('dialog');
    const length = editor.getByLabel(/^Room length/);
    await length.waitFor();

    await length.fill('12 ft 6 in');
    await length.press('Tab');
    // 12 ft + 6/12 ft.
    await expect.poll(() => length.inputValue()).toBe('12.5');

    await length.fill('3.2 m');
    await length.press('Tab');
    // 3.2 m ÷ 0.3048 m/ft (exact by definition) = 10.49868… ft, kept to four places.
    await expect.poll(() => length.inputValue()).toBe('10.4987');

    const area = editor.getByLabel(/^Floor area/);
    await area.fill('30*20');
    await area.press('Tab');
    await expect.poll(() => area.inputValue()).toBe('600');

    await length.fill('2 kg');
    await length.press('Tab');
    await editor.getByText('Write a length (for example 12 ft 6 in, or 3.2 m).').waitFor();
    expect(await length.inputValue()).toBe('2 kg');
  });
});
