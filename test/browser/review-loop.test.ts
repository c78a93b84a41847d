/// <reference lib="dom" />
import type { ParsedMail } from 'mailparser';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { closeMailBrowserSuite, keptMails, openMailBrowserSuite, signInToDemo, type MailBrowserSuite } from '../support/browser-suite.js';

let suite: MailBrowserSuite;
let projectUrl = '';

const engineerEmail = 'engineer@alderbay.example';
const reviewerEmail = 'reviewer@alderbay.example';
const checkedItem = '101 Entry lobby: Power allowance';

/** Waits until the sender has handed over a message with this subject to this address; answers it. */
async function mailArrives(address: string, subject: RegExp): Promise<ParsedMail> {
  let found: ParsedMail | undefined;
  await expect
    .poll(
      async () => {
        await suite.sender.drain();
        found = (await keptMails(suite.mailDir)).find(
          (mail) => subject.test(mail.subject ?? '') && [mail.to ?? []].flat().some((to) => to.text.includes(address)),
        );
        return found !== undefined;
      },
      { timeout: 15_000 },
    )
    .toBe(true);
  return found!;
}

beforeAll(async () => {
  suite = await openMailBrowserSuite();
  suite.browser.page.setDefaultTimeout(15_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await suite.browser.screenshot(`failed-review-loop-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeMailBrowserSuite(suite));

async function signIn(email: string): Promise<void> {
  projectUrl = await signInToDemo(suite, email, inject('demoPassword'));
}

async function signOut(): Promise<void> {
  await suite.browser.page.getByRole('button', { name: 'Sign out' }).click();
  await suite.browser.page.waitForURL(/\/sign-in/);
}

const stateBar = () => suite.browser.page.getByTestId('review-state');
/** The button of one check item in the review page's list. */
const itemButton = (title: string) =>
  suite.browser.page.locator('.item-list button', { has: suite.browser.page.locator(`[title="${title}"]`) });
const detail = () => suite.browser.page.getByTestId('review-detail');

describe('a review from submission to acceptance', () => {
  it('the engineer submits the demo project, and the reviewers are told by mail', async () => {
    await signIn(engineerEmail);
    const { page } = suite.browser;
    await page.goto(`${projectUrl}/results`);
    await stateBar().getByRole('button', { name: 'Submit for review' }).click();
    await expect.poll(() => stateBar().textContent()).toContain('In review');
    const mail = await mailArrives(reviewerEmail, /review/i);
    expect(mail.text).toContain('Alder Bay Library & Makerspace');
    expect(mail.text).toMatch(new RegExp(`${suite.appUrl}/projects/[0-9a-f-]+/review`));
    await signOut();
  }, 90_000);

  it('the reviewer finds it on the desk, marks one item as needing revision by keyboard, and returns it', async () => {
    await signIn(reviewerEmail);
    const { page } = suite.browser;
    await page.goto(`${suite.served.baseUrl}/review`);
    const row = page.getByRole('link', { name: 'Alder Bay Library & Makerspace' });
    await row.waitFor();
    await suite.browser.screenshot('review-desk');
    await row.click();
    await page.waitForURL(/\/review$/);
    await itemButton(checkedItem).click();
    await expect.poll(() => detail().locator('h3').first().textContent()).toBe(checkedItem);
    await detail().getByText('Values the engine used').or(detail().locator('dl.values')).first().waitFor();

    // r asks for the comment a revision needs; Ctrl+Enter records it.
    await page.locator('body').press('r');
    const comment = detail().getByLabel('What needs revision');
    await comment.waitFor();
    await comment.fill('The lobby is larger on the latest plan; enter its measured area.');
    await comment.press('Control+Enter');
    await expect.poll(() => itemButton(checkedItem).getAttribute('data-verdict')).toBe('needs-revision');
    await suite.browser.screenshot('review-page');

    await stateBar().getByRole('button', { name: 'Return to the engineer' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('What needs revision').fill('One check item needs revision: the entry lobby’s area.');
    await dialog.getByRole('button', { name: 'Return to the engineer' }).click();
    await dialog.waitFor({ state: 'detached' });
    await expect.poll(() => stateBar().textContent()).toContain('Returned');
    const mail = await mailArrives(engineerEmail, /returned/i);
    expect(mail.text).toContain('the entry lobby’s area');
    await signOut();
  }, 90_000);

  it('the engineer sees the marker on the space, fixes it and submits again', async () => {
    await signIn(engineerEmail);
    const { page } = suite.browser;
    await page.goto(`${projectUrl}/spaces`);
    const marker = page.getByTestId('revision-marker');
    await marker.first().waitFor();
    expect(await marker.count()).toBe(1);
    expect(await marker.first().getAttribute('title')).toBe('1 item needs revision');

    await page.getByRole('button', { name: /^Edit 101 Entry lobby/ }).click();
    const editor = page.getByRole('dialog');
    await editor.getByLabel(/^Room length/).fill('32');
    await editor.getByLabel(/^Floor area/).fill('640');
    await editor.getByRole('button', { name: 'Save space' }).click();
    await editor.waitFor({ state: 'detached' });

    await stateBar().getByRole('button', { name: 'Submit again' }).click();
    await expect.poll(() => stateBar().textContent()).toContain('In review');
    await signOut();
  }, 90_000);

  it('the reviewer sees the item changed, confirms every item and accepts; the engineer is told', async () => {
    await signIn(reviewerEmail);
    const { page } = suite.browser;
    await page.goto(`${projectUrl}/review`);
    await itemButton(checkedItem).waitFor();
    // Its data changed since the last round: the verdict was cleared and it says so.
    await expect.poll(() => itemButton(checkedItem).getAttribute('data-verdict')).toBe('open');
    expect(await itemButton(checkedItem).textContent()).toContain('Changed');

    await page.getByRole('button', { name: /^Confirm all unchanged/ }).click();
    await itemButton(checkedItem).click();
    await expect.poll(() => detail().locator('h3').first().textContent()).toBe(checkedItem);
    await page.locator('body').press('c');
    await expect.poll(() => itemButton(checkedItem).getAttribute('data-verdict')).toBe('confirmed');
    // The lobby's other items changed with its area too: the reviewer looks at each and confirms it.
    const open = page.locator('.item-list button[data-verdict="open"]');
    for (let left = await open.count(); left > 0; left = await open.count()) {
      const title = await open.first().locator('[title]').first().getAttribute('title');
      await open.first().click();
      await expect.poll(() => detail().locator('h3').first().textContent()).toBe(title);
      await page.locator('body').press('c');
      await expect.poll(() => open.count()).toBe(left - 1);
    }

    await stateBar().getByRole('button', { name: 'Accept' }).click();
    await expect.poll(() => stateBar().textContent()).toContain('Accepted');
    const mail = await mailArrives(engineerEmail, /accepted/i);
    expect(mail.text).toContain('Alder Bay Library & Makerspace');

    // Every move, verdict and reply is in the project's history.
    const history = await page.evaluate(
      async (url) => (await fetch(`${url}/history?limit=200`)).json(),
      projectUrl.replace(suite.served.baseUrl, '/api'),
    );
    const actions = (history as { entries: { action: string }[] }).entries.map((entry) => entry.action);
    expect(actions).toEqual(expect.arrayContaining(['transition', 'verdict', 'bulk-confirm']));
  }, 90_000);
});
