/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';
import { seriousViolations as violationsOn } from '../support/axe.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl: string;

/** The axe findings on the suite's page. */
const seriousViolations = () => violationsOn(browser.page);

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('accessibility (axe-core, WCAG 2.1 AA)', () => {
  it('the pages for a forgotten password', async () => {
    await browser.page.goto(`${served.baseUrl}/forgot-password`);
    await browser.page.getByLabel('E-mail').waitFor();
    expect(await seriousViolations(), 'forgot-password').toEqual([]);
    await browser.page.goto(`${served.baseUrl}/reset-password?token=some-token`);
    await browser.page.getByLabel('New password again').waitFor();
    expect(await seriousViolations(), 'reset-password').toEqual([]);
  });

  it('the sign-in page', async () => {
    await browser.page.goto(`${served.baseUrl}/sign-in`);
    await browser.page.getByLabel('E-mail').waitFor();
    expect(await seriousViolations()).toEqual([]);
  });

  it('the projects list', async () => {
    const { page } = browser;
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    await page.getByText('Alder Bay Library & Makerspace').first().waitFor();
    const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
    projectUrl = `${served.baseUrl}/projects/${projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id}`;
    expect(await seriousViolations()).toEqual([]);
  });

  it('the account page', async () => {
    const { page } = browser;
    await page.getByTestId('signed-in-user').click();
    await page.getByTestId('session').first().waitFor();
    // The pointer still rests on the top bar's name, whose tooltip fades in: move it away and let
    // the tooltip go, so the rules read the page rather than a half-transparent tooltip.
    await page.mouse.move(0, 400);
    await page.locator('.mat-mdc-tooltip-surface').waitFor({ state: 'detached' });
    expect(await seriousViolations()).toEqual([]);
  });

  for (const area of [
    'setup',
    'spaces',
    'luminaires',
    'allowances',
    'controls',
    'daylight',
    'exterior',
    'results',
    'review',
    'compare',
    'package',
    'field-tests',
    'history',
  ]) {
    it(`the ${area} page`, async () => {
      const { page } = browser;
      await page.goto(`${projectUrl}/${area}`);
      await expect.poll(() => page.getByTestId('workspace-verdict').textContent(), { timeout: 10_000 }).toContain('Complies');
      // The history and the comparison arrive apart from the design: wait for them.
      if (area === 'history') await page.locator('.entry').first().waitFor();
      if (area === 'compare') await page.getByTestId('edition-column').first().waitFor();
      if (area === 'package') await page.getByText('No package has been made yet.').waitFor();
      if (area === 'field-tests') await page.getByTestId('field-test-item').first().waitFor();
      // The check items too: their list, or the words of why there is none.
      if (area === 'review') await page.locator('al-review-page').locator('.item-list, p.empty, p.failure').first().waitFor();
      expect(await seriousViolations()).toEqual([]);
    });
  }

  it('the review desk', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/review`);
    await page.getByRole('heading', { name: 'Review desk', level: 1 }).waitFor();
    await page.locator('al-review-desk-page').locator('table, p.message').first().waitFor();
    expect(await seriousViolations()).toEqual([]);
  });

  it('the compare page in the dark colour scheme', async () => {
    const { page } = browser;
    await page.emulateMedia({ colorScheme: 'dark' });
    try {
      await page.goto(`${projectUrl}/compare`);
      await page.getByTestId('edition-column').first().waitFor();
      expect(await seriousViolations()).toEqual([]);
    } finally {
      await page.emulateMedia({ colorScheme: 'light' });
    }
  });

  it('the luminaire counts as cards on a phone, in both colour schemes', async () => {
    const { page } = browser;
    // A phone held upright, 390 × 844 CSS pixels (common practice for a current mid-size phone).
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${projectUrl}/luminaires?tab=counts`);
    await page.getByRole('list', { name: 'Luminaire counts by space' }).getByRole('group', { name: '101 Entry lobby' }).waitFor();
    await expect.poll(() => page.getByTestId('workspace-verdict').textContent(), { timeout: 10_000 }).toContain('Complies');
    expect(await seriousViolations(), 'light').toEqual([]);
    await page.emulateMedia({ colorScheme: 'dark' });
    expect(await seriousViolations(), 'dark').toEqual([]);
    await page.emulateMedia({ colorScheme: 'light' });
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('the workspace and the sign-in page in the dark colour scheme', async () => {
    const { page } = browser;
    await page.emulateMedia({ colorScheme: 'dark' });
    for (const area of ['spaces', 'daylight', 'results', 'history']) {
      await page.goto(`${projectUrl}/${area}`);
      await expect.poll(() => page.getByTestId('workspace-verdict').textContent(), { timeout: 10_000 }).toContain('Complies');
      if (area === 'history') await page.locator('.entry').first().waitFor();
      expect(await seriousViolations(), area).toEqual([]);
    }
    await browser.screenshot('dark-results');
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').waitFor();
    expect(await seriousViolations(), 'sign-in').toEqual([]);
    await page.emulateMedia({ colorScheme: 'light' });
  });
});
