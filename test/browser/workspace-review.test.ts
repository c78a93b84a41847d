import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl: string;
/** The reading room's first required control that the demo design meets; the engineer changes it. */
let strategy: string;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(email: string): Promise<void> {
  const { page } = browser;
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
  if (!projectUrl) {
    const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace');
    projectUrl = `${served.baseUrl}/projects/${demo!.id}`;
  }
}

async function signOut(): Promise<void> {
  await browser.page.getByRole('button', { name: 'Sign out' }).click();
  await browser.page.waitForURL(/\/sign-in/);
}

async function resultsSettled(): Promise<void> {
  await expect.poll(() => browser.page.getByTestId('workspace-verdict').textContent(), { timeout: 10_000 }).not.toContain('Updating');
}

describe('the engineer works through controls, daylight, exterior and results', () => {
  it('opens the Controls page and reads each requirement with its status in words', async () => {
    await signIn('engineer@alderbay.example');
    const { page } = browser;
    await page.goto(`${projectUrl}/controls`);
    await page.getByRole('heading', { name: 'Controls', level: 2 }).waitFor();
    await resultsSettled();
    await page.getByRole('button', { name: /102 Main reading room/ }).click();
    await page.getByRole('heading', { name: '102 Main reading room', level: 3 }).waitFor();
    const met = page
      .locator('.detail > .lines > al-control-line-card')
      .filter({ has: page.locator('.status[data-status="met"]') })
      .first();
    await met.waitFor();
    strategy = (await met.locator('article').getAttribute('data-strategy'))!;
    expect(await met.locator('.status').textContent()).toContain('Met');
    expect(await met.locator('.requirement').textContent()).toMatch(/C405\.2/);
    await browser.screenshot('workspace-controls-engineer');
  }, 40_000);

  it('records a control as not provided and then provided again, and the results follow', async () => {
    const { page } = browser;
    const card = page.locator('al-control-line-card', { has: page.locator(`[data-strategy="${strategy}"]`) });
    await card.getByRole('button', { name: /what is provided/ }).click();
    await card.getByRole('radio', { name: 'Not provided', exact: true }).check();
    await card.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => card.locator('.status').textContent(), { timeout: 10_000 }).toContain('Not met');
    await expect.poll(() => page.getByTestId('workspace-verdict').textContent()).toContain('Does not comply');

    await card.getByRole('button', { name: /what is provided/ }).click();
    await card.getByRole('radio', { name: 'Provided', exact: true }).check();
    await card.getByLabel('Device').fill('Demo device, entered by the browser test');
    await card.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => card.locator('.status').textContent(), { timeout: 10_000 }).toContain('Met');
    expect(await card.textContent()).toContain('Demo device, entered by the browser test');
    await resultsSettled();
    expect(await page.getByTestId('workspace-verdict').textContent()).toContain('Complies');
    expect(await page.getByRole('heading', { level: 3 }).first().textContent()).toContain('102 Main reading room');
  }, 40_000);

  it('shows the main reading room on the Daylight page as a plan with its sidelit zones', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/daylight`);
    await page.getByRole('heading', { name: 'Daylight', level: 2 }).waitFor();
    await page.getByRole('button', { name: /102 Main reading room/ }).click();
    const plan = page.getByTestId('daylight-plan');
    await plan.waitFor();
    expect(await plan.locator('title').textContent()).toContain('102 Main reading room');
    await expect.poll(() => plan.locator('g.zone').count()).toBeGreaterThan(0);
    expect(await plan.locator('g.window[data-wall="south"]').count()).toBe(3);
    expect(await page.getByText('Sidelighting control required').count()).toBe(1);
    await browser.screenshot('workspace-daylight-engineer');
  });

  it('shows the exterior applications grouped, with the allowance and margin', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/exterior`);
    await page.getByRole('heading', { name: 'Exterior', level: 2 }).waitFor();
    await page.getByTestId('tradable-table').getByText('Parking lots and drives').waitFor();
    expect(await page.getByTestId('nontradable-table').textContent()).toContain('Building facades');
    await resultsSettled();
    expect(await page.getByTestId('exterior-totals').textContent()).toContain('Within allowance');
    await browser.screenshot('workspace-exterior-engineer');
  });

  it('shows the verdict, margin, chart and space table on the Results page', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/results`);
    await page.getByRole('heading', { name: 'Results', level: 2 }).waitFor();
    await expect.poll(() => page.getByTestId('results-state').textContent(), { timeout: 10_000 }).toContain('Up to date');
    const verdict = page.getByTestId('results-verdict');
    expect(await verdict.textContent()).toMatch(/Complies|Does not comply/);
    expect(await verdict.textContent()).toContain('Margin');
    expect(await verdict.textContent()).toMatch(/Within allowance|Over allowance/);
    await page.getByRole('table', { name: 'Results by space' }).getByText('102 Main reading room').waitFor();
    expect(await page.getByRole('note', { name: 'Cautions' }).textContent()).toContain('authority having jurisdiction');
    await page.locator('canvas').first().waitFor();
    await browser.screenshot('workspace-results-engineer');
    await signOut();
  });
});

describe('the reviewer reads the same pages without edit controls', () => {
  it('opens Controls, Daylight, Exterior and Results read-only', async () => {
    await signIn('reviewer@alderbay.example');
    const { page } = browser;

    await page.goto(`${projectUrl}/controls`);
    await page.getByRole('heading', { name: 'Controls', level: 2 }).waitFor();
    await page.locator('al-control-line-card').first().waitFor();
    await resultsSettled();
    expect(await page.getByRole('button', { name: /what is provided/ }).count()).toBe(0);
    await browser.screenshot('workspace-controls-reviewer');

    await page.goto(`${projectUrl}/daylight`);
    await page.getByTestId('daylight-plan').waitFor();
    await resultsSettled();
    await page.getByTestId('daylight-plan').locator('g.zone').first().waitFor();
    expect(await page.getByRole('button', { name: /Add a window|Add a skylight|Save openings/ }).count()).toBe(0);
    expect(await page.locator('form.openings input:not([disabled])').count()).toBe(0);
    await browser.screenshot('workspace-daylight-reviewer');

    await page.goto(`${projectUrl}/exterior`);
    await page.getByTestId('tradable-table').getByText('Parking lots and drives').waitFor();
    await resultsSettled();
    expect(await page.getByRole('button', { name: /Save zone|Add an exterior application|Change |Remove / }).count()).toBe(0);
    await browser.screenshot('workspace-exterior-reviewer');

    await page.goto(`${projectUrl}/results`);
    await expect.poll(() => page.getByTestId('results-state').textContent(), { timeout: 10_000 }).toContain('Up to date');
    expect(await page.getByTestId('results-verdict').textContent()).toMatch(/Complies|Does not comply/);
    await browser.screenshot('workspace-results-reviewer');
  });
});
