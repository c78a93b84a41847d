/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl: string;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const { page } = browser;
  // A tablet held upright (common practice for the narrowest layout the workspace supports).
  await page.setViewportSize({ width: 800, height: 1100 });
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('engineer@alderbay.example');
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
  const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
  projectUrl = `${served.baseUrl}/projects/${projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id}`;
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('the workspace at a tablet width (800 px)', () => {
  for (const area of [
    'spaces',
    'luminaires',
    'allowances',
    'controls',
    'daylight',
    'exterior',
    'results',
    'compare',
    'package',
    'history',
  ]) {
    it(`lays out ${area} without a sideways scroll of the page`, async () => {
      const { page } = browser;
      await page.goto(`${projectUrl}/${area}`);
      await expect.poll(() => page.getByTestId('workspace-verdict').textContent(), { timeout: 10_000 }).toContain('Complies');
      // The history arrives apart from the design: wait for its entries.
      if (area === 'history') await page.locator('.entry').first().waitFor();
      if (area === 'compare') await page.getByTestId('edition-column').first().waitFor();
      if (area === 'package') await page.getByText('No package has been made yet.').waitFor();
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      await browser.screenshot(`tablet-${area}`);
      expect(overflow).toBeLessThanOrEqual(1);
    });
  }
});
