/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;

// A user agent in the shape that browser sends (from memory; version invented).
const windowsFirefox = 'Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:131.0) Gecko/20100101 Firefox/131.0';

/** A sign-in from somewhere else, as a script would make it: the session cookie to send back. */
async function signInElsewhere(userAgent: string): Promise<string> {
  const response = await fetch(`${served.baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'User-Agent': userAgent },
    body: JSON.stringify({ email: 'engineer@alderbay.example', password: inject('demoPassword') }),
  });
  expect(response.status).toBe(200);
  return response.headers
    .getSetCookie()
    .find((cookie) => cookie.startsWith('allowlight_session='))!
    .split(';')[0]!;
}

const statusWith = async (cookie: string): Promise<number> =>
  (await fetch(`${served.baseUrl}/api/auth/me`, { headers: { Cookie: cookie } })).status;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('the Account page', () => {
  it('lists both sessions in words and ends the other one, which the service then refuses', async () => {
    const elsewhere = await signInElsewhere(windowsFirefox);
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').click();
    await page.getByRole('heading', { name: 'Account' }).waitFor();

    const sessions = page.getByTestId('session');
    await expect.poll(() => sessions.count()).toBe(2);
    const here = sessions.filter({ hasText: 'This browser' });
    expect(await here.textContent()).toContain('Chrome on Linux');
    const other = sessions.filter({ hasText: 'Firefox on Windows' });
    expect(await other.textContent()).toContain('From address 127.0.0.1');
    expect(await here.getByRole('button', { name: 'End session' }).count()).toBe(0);
    await browser.screenshot('account-two-sessions');
    expect(await statusWith(elsewhere)).toBe(200);

    await other.getByRole('button', { name: 'End session' }).click();
    await expect.poll(() => page.getByRole('status').textContent()).toContain('The session on Firefox on Windows has ended.');
    await expect.poll(() => sessions.count()).toBe(1);
    expect(await statusWith(elsewhere)).toBe(401);
  });

  it('ends all other sessions at once', async () => {
    const { page } = browser;
    const phone = await signInElsewhere(windowsFirefox);
    const script = await signInElsewhere('a-script/2.1');
    await page.reload();
    await expect.poll(() => page.getByTestId('session').count()).toBe(3);
    expect(await page.getByTestId('session').filter({ hasText: 'Unknown browser' }).count()).toBe(1);

    await page.getByRole('button', { name: 'End all other sessions' }).click();
    await expect.poll(() => page.getByRole('status').textContent()).toContain('2 other sessions have ended.');
    await page.getByText('This browser is your only session.').waitFor();
    expect(await statusWith(phone)).toBe(401);
    expect(await statusWith(script)).toBe(401);
    await page.reload();
    await page.getByTestId('session').filter({ hasText: 'This browser' }).waitFor();
  });

  it('lays out without a sideways scroll at a tablet width (800 px)', async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 800, height: 1100 });
    await page.getByTestId('session').first().waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    await browser.screenshot('tablet-account');
    expect(overflow).toBeLessThanOrEqual(1);
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('keeps the Secure session cookie on http://127.0.0.1, and a copy of it is refused after signing out', async () => {
    const { page, context } = browser;
    const [cookie] = (await context.cookies()).filter((entry) => entry.name === 'allowlight_session');
    expect(cookie).toMatchObject({ secure: true, httpOnly: true, sameSite: 'Lax' });
    const kept = `${cookie!.name}=${cookie!.value}`;
    expect(await statusWith(kept)).toBe(200);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    expect(await statusWith(kept)).toBe(401);
  });

  it('offers a reviewer the daily review digest, and keeps the choice', async () => {
    const { page } = browser;
    await signInToDemo({ browser, served }, 'reviewer@alderbay.example', inject('demoPassword'));
    await page.goto(`${served.baseUrl}/account`);
    const digest = page.getByRole('switch', { name: 'Send me the daily review digest' });
    await digest.waitFor();
    expect(await digest.getAttribute('aria-checked')).toBe('false');
    await digest.click();
    await expect
      .poll(() => page.getByRole('status').filter({ hasText: 'review digest' }).textContent())
      .toContain('The daily review digest is on.');
    await browser.screenshot('account-review-digest');
    await page.reload();
    await expect
      .poll(() => page.getByRole('switch', { name: 'Send me the daily review digest' }).getAttribute('aria-checked'))
      .toBe('true');
    const stored = await database.db('users').where({ email: 'reviewer@alderbay.example' }).first('review_digest');
    expect(stored).toEqual({ review_digest: true });
  });
});
