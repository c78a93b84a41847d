/// <reference lib="dom" />
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { MailSender } from '../../service/src/mail/mail-sender.js';
import type { Browser, Served } from '../support/browser.js';
import { closeMailBrowserSuite, keptMails, openMailBrowserSuite, type MailBrowserSuite } from '../support/browser-suite.js';

let suite: MailBrowserSuite;
let served: Served;
let browser: Browser;
let sender: MailSender;
let mailDir: string;

const password = 'copper heron lantern 73';

/** The newest message the local mail server kept for an address. */
async function lastMailTo(address: string) {
  const mails = await keptMails(mailDir);
  return mails.filter((mail) => (Array.isArray(mail.to) ? mail.to : [mail.to]).some((to) => to?.text.includes(address))).at(-1);
}

beforeAll(async () => {
  suite = await openMailBrowserSuite();
  ({ served, browser, sender, mailDir } = suite);
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-invitations-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeMailBrowserSuite(suite));

describe('an invitation to the team', () => {
  it('is sent from the team panel, withdrawn after asking, and accepted from the mailed link into the project', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    const engineerName = ((await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { user: { name: string } }).user.name;
    const projects = (await (await page.request.get(`${served.baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!;

    await page.goto(`${served.baseUrl}/projects/${demo.id}/setup`);
    const invitations = page.getByRole('list', { name: 'Invitations' });
    const inviteForm = page.getByRole('form', { name: 'Invite by e-mail' });
    await inviteForm.waitFor();
    await page.getByText('No invitation is waiting for an answer.').waitFor();

    // One invitation to withdraw again, after the question.
    await page.getByLabel('E-mail address to invite').fill('second-thoughts@elsewhere.example');
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await page.getByRole('status').getByText('An invitation is on its way to second-thoughts@elsewhere.example.').waitFor();
    await page.getByRole('button', { name: 'Withdraw the invitation of second-thoughts@elsewhere.example' }).click();
    const question = page.getByRole('alertdialog');
    await question.getByText('The link in their message stops working.').waitFor();
    await question.getByRole('button', { name: 'Withdraw the invitation' }).click();
    await page.getByRole('status').getByText('The invitation of second-thoughts@elsewhere.example is withdrawn.').waitFor();
    await expect.poll(() => invitations.count()).toBe(0);

    // The one to accept, as a contractor.
    await page.getByLabel('E-mail address to invite').fill('newcomer@elsewhere.example');
    await page.getByLabel('Role of the invited').click();
    await page.getByRole('option', { name: 'Contractor' }).click();
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await page.getByRole('status').getByText('An invitation is on its way to newcomer@elsewhere.example.').waitFor();
    const item = invitations.getByRole('listitem').filter({ hasText: 'newcomer@elsewhere.example' });
    await item.getByText('Contractor').waitFor();
    await item.getByText(`Invited by ${engineerName}`).waitFor();
    await item.getByText(/^Expires /).waitFor();
    await browser.screenshot('invitations-team-panel');

    await sender.drain();
    const mail = await lastMailTo('newcomer@elsewhere.example');
    expect(mail?.subject).toBe(`${engineerName} invites you to Alder Bay Library & Makerspace on Allowlight`);
    const link = new URL(/http:\/\/allowlight\.localhost\/invitation\?token=[\w-]+/.exec(mail?.text ?? '')![0]);
    // The withdrawn address had its own message; its link no longer works.
    const withdrawnMail = await lastMailTo('second-thoughts@elsewhere.example');
    const withdrawnLink = new URL(/http:\/\/allowlight\.localhost\/invitation\?token=[\w-]+/.exec(withdrawnMail?.text ?? '')![0]);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign in' }).waitFor();

    await page.goto(`${served.baseUrl}${withdrawnLink.pathname}${withdrawnLink.search}`);
    await page.getByRole('alert').getByText('This invitation was withdrawn.').waitFor();

    await page.goto(`${served.baseUrl}${link.pathname}${link.search}`);
    await page.getByRole('heading', { name: 'Join a project' }).waitFor();
    await page.getByText(`${engineerName} invites you to the team of Alder Bay Library & Makerspace as a contractor.`).waitFor();
    await page.getByText('Your account will be newcomer@elsewhere.example.').waitFor();
    await page.getByLabel('Your name').fill('Noor Castellanos');
    await page.getByLabel('New password', { exact: true }).fill('password1234');
    await page.getByLabel('New password again').fill('password1234');
    await page.getByRole('button', { name: 'Join the project' }).click();
    await page.getByRole('alert').getByText('too easy to guess').waitFor();
    await page.getByLabel('New password', { exact: true }).fill(password);
    await page.getByLabel('New password again').fill(password);
    await browser.screenshot('invitation-page');
    await page.getByRole('button', { name: 'Join the project' }).click();

    await page.getByRole('heading', { level: 1, name: 'Alder Bay Library & Makerspace' }).waitFor();
    await expect.poll(() => page.getByTestId('signed-in-user').textContent()).toContain('Noor Castellanos');
    expect(new URL(page.url()).pathname).toMatch(new RegExp(`^/projects/${demo.id}`));
    await browser.screenshot('invitation-accepted');

    // The link is spent.
    await page.goto(`${served.baseUrl}${link.pathname}${link.search}`);
    await page.getByRole('alert').getByText('This invitation was used already.').waitFor();
  }, 120_000);
});
