/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { MailSender } from '../../service/src/mail/mail-sender.js';
import type { Browser, Served } from '../support/browser.js';
import { closeMailBrowserSuite, keptMails, openMailBrowserSuite, type MailBrowserSuite } from '../support/browser-suite.js';

let suite: MailBrowserSuite;
let served: Served;
let browser: Browser;
let sender: MailSender;
let mailDir: string;

const newPassword = 'amber lantern orchard 9';
const laterPassword = 'quiet copper meadow 51';

/** The newest message the local mail server kept. */
async function lastMail() {
  return (await keptMails(mailDir)).at(-1)!;
}

beforeAll(async () => {
  suite = await openMailBrowserSuite();
  ({ served, browser, sender, mailDir } = suite);
});

afterAll(() => closeMailBrowserSuite(suite));

describe('passwords and accounts', () => {
  it('a forgotten password is replaced through the link the mail carries', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByRole('status').getByText('a link to choose a new password is on its way').waitFor();

    await sender.drain();
    const mail = await lastMail();
    expect(mail.subject).toBe('Choose a new Allowlight password');
    const link = new URL(/http:\/\/allowlight\.localhost\/reset-password\?token=[\w-]+/.exec(mail.text ?? '')![0]);
    await page.goto(`${served.baseUrl}${link.pathname}${link.search}`);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();

    await page.getByLabel('New password', { exact: true }).fill('password1234');
    await page.getByLabel('New password again').fill('password1235');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText('The two passwords differ.').waitFor();
    await page.getByLabel('New password again').fill('password1234');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByRole('alert').getByText('too easy to guess').waitFor();

    await page.getByLabel('New password', { exact: true }).fill(newPassword);
    await page.getByLabel('New password again').fill(newPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByRole('status').getByText('Your new password is saved').waitFor();
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    await page.screenshot({ path: 'test-output/browser/password-reset-signed-in.png' });

    // The same link a second time.
    await page.goto(`${served.baseUrl}${link.pathname}${link.search}`);
    await page.getByLabel('New password', { exact: true }).fill(laterPassword);
    await page.getByLabel('New password again').fill(laterPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByRole('alert').getByText('expired or was already used').waitFor();
    await page.getByRole('link', { name: 'Ask for a new link' }).waitFor();
  }, 90_000);

  it('the Account page changes the password, refusing a wrong current one on its field', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/account`);
    await page.getByRole('heading', { name: 'Password' }).waitFor();
    await page.getByLabel('Current password').fill('not my password');
    await page.getByLabel('New password', { exact: true }).fill(laterPassword);
    await page.getByLabel('New password again').fill(laterPassword);
    await page.getByRole('button', { name: 'Change the password' }).click();
    await page.getByText('The current password is not correct.').waitFor();

    await page.getByLabel('Current password').fill(newPassword);
    await page.getByRole('button', { name: 'Change the password' }).click();
    await page.getByRole('status').getByText('Your password is changed.').waitFor();
    await page.screenshot({ path: 'test-output/browser/password-changed.png', fullPage: true });
    const signIn = await fetch(`${served.baseUrl}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@alderbay.example', password: laterPassword }),
    });
    expect(signIn.status).toBe(200);
  }, 60_000);

  it("the administrator's Outbox lists the mail and shows a message without its reset link", async () => {
    const { page } = browser;
    await sender.drain();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByLabel('E-mail').fill('admin@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox' }).waitFor();
    const rows = page.locator('table tbody tr');
    await rows.first().waitFor();
    expect(await rows.count()).toBe(3);
    await page.getByRole('button', { name: 'Choose a new Allowlight password' }).click();
    const message = page.getByRole('region', { name: 'Choose a new Allowlight password' });
    await message.getByText('reset-password?token=(hidden)').waitFor();
    expect(await message.textContent()).toContain('engineer@alderbay.example');
    await page.screenshot({ path: 'test-output/browser/outbox.png', fullPage: true });
  }, 60_000);

  it('the People page makes an account, whose owner chooses a password from the mail, and disables it', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'People' }).click();
    await page.getByRole('heading', { name: 'People' }).waitFor();
    await page.getByLabel('Name').fill('Noor Castellanos');
    await page.getByLabel('E-mail').fill('surveyor@alderbay.example');
    await page.getByRole('button', { name: 'Create the account' }).click();
    await page.getByRole('status').getByText('Noor Castellanos has an account now').waitFor();
    const row = page.getByRole('row', { name: /Noor Castellanos/ });
    await row.getByText('Enabled').waitFor();

    await sender.drain();
    const mail = await lastMail();
    expect(mail.subject).toBe('Your Allowlight account');
    const link = new URL(/http:\/\/allowlight\.localhost\/reset-password\?token=[\w-]+/.exec(mail.text ?? '')![0]);
    const owner = await browser.context.newPage();
    try {
      await owner.goto(`${served.baseUrl}${link.pathname}${link.search}`);
      await owner.getByLabel('New password', { exact: true }).fill(newPassword);
      await owner.getByLabel('New password again').fill(newPassword);
      await owner.getByRole('button', { name: 'Save the new password' }).click();
      await owner.getByRole('status').getByText('Your new password is saved').waitFor();
    } finally {
      await owner.close();
    }
    const signIn = (password: string) =>
      fetch(`${served.baseUrl}/api/auth/login`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: 'surveyor@alderbay.example', password }),
      });
    expect((await signIn(newPassword)).status).toBe(200);

    await row.getByRole('button', { name: 'Disable' }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Disable the account' }).click();
    await page.getByRole('status').getByText("Noor Castellanos's account is disabled.").waitFor();
    await row.getByText('Disabled').waitFor();
    await page.screenshot({ path: 'test-output/browser/people.png', fullPage: true });
    expect((await signIn(newPassword)).status).toBe(403);
  }, 60_000);
});
