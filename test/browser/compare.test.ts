/// <reference lib="dom" />
import type { Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl = '';
let comparison: Comparison;

interface Edition {
  edition: string;
  title: string;
  status: 'evaluated' | 'not-mapped' | 'not-valid';
  unmapped: { what: string; name: string; type: string }[];
  controlsNotCarried: string[];
  controlChanges: { place: string; changes: { control: string }[] }[];
  result: {
    units: 'ip' | 'si';
    area: string;
    allowanceW: string;
    installedW: string;
    marginW: string;
    interiorComplies: boolean;
    exterior: { allowanceW: string; installedW: string; marginW: string; complies: boolean } | null;
    controls: { met: number; notMet: number; toVerify: number };
    unverifiedValues: number;
  } | null;
}

interface Comparison {
  current: Edition;
  editions: Edition[];
}

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  await browser.page.emulateMedia({ media: 'screen' });
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-compare-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

// The page rounds watts to 1 W and areas to 1 ft² or 0.1 m² (the design notes' display rounding), with en-US grouping.
const watts = (value: string) => `${new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(Number(value))} W`;
const area = (value: string, units: 'ip' | 'si') =>
  `${new Intl.NumberFormat('en-US', { maximumFractionDigits: units === 'ip' ? 0 : 1 }).format(Number(value))} ${units === 'ip' ? 'ft²' : 'm²'}`;
/** What a part of the page says, without its icons' ligature names. */
const words = (locator: Locator) =>
  locator.evaluate((node) => {
    const copy = node.cloneNode(true) as Element;
    copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
  });

const columns = (page: Page) => page.getByTestId('edition-column');
const column = (page: Page, edition: string) => page.locator(`[data-testid="edition-column"][data-edition="${edition}"]`);
const figure = (place: Locator, name: string) => place.locator(`[data-figure="${name}"]`);

describe('the Compare editions page', { timeout: 90_000 }, () => {
  it('sets the demo beside every edition the API compares it under, with the figures the API gives', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@alderbay.example');
    const projects = (await (await page.request.get(`${served.baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!;
    projectUrl = `${served.baseUrl}/projects/${demo.id}`;
    const response = await page.request.get(`${served.baseUrl}/api/projects/${demo.id}/comparison`);
    expect(response.status()).toBe(200);
    comparison = (await response.json()) as Comparison;

    await page.goto(`${projectUrl}/results`);
    const link = page.getByRole('link', { name: 'Compare', exact: true });
    await link.waitFor();
    // The area comes after Results and its Review in the project's navigation (each link's text ends with its label, after its icon's).
    const labels = await page.getByRole('navigation', { name: 'Project areas' }).getByRole('link').allInnerTexts();
    const position = (label: string) => labels.findIndex((text) => text.trim().endsWith(label));
    expect(position('Compare')).toBeGreaterThan(0);
    expect(position('Review')).toBe(position('Results') + 1);
    expect(position('Compare')).toBe(position('Review') + 1);
    await link.click();
    await page.waitForURL(/\/compare$/);
    await page.getByRole('heading', { name: 'Compare editions', level: 2 }).waitFor();

    const all = [comparison.current, ...comparison.editions];
    await expect.poll(() => columns(page).count()).toBe(all.length);
    expect(await columns(page).evaluateAll((nodes) => nodes.map((node) => node.getAttribute('data-edition')))).toEqual(
      all.map((edition) => edition.edition),
    );
    // The project's own edition is first, and the only one marked so.
    expect(await page.getByTestId('own-edition').count()).toBe(1);
    expect(await column(page, comparison.current.edition).getByTestId('own-edition').isVisible()).toBe(true);
    expect(await page.getByRole('note', { name: 'Cautions' }).isVisible()).toBe(true);

    for (const edition of all) {
      const place = column(page, edition.edition);
      expect(await words(place.locator('.title'))).toBe(edition.title);
      const heading = await words(place.getByRole('heading', { level: 3 }));
      expect(heading, edition.edition).not.toContain(edition.edition);
      const result = edition.result;
      if (!result) {
        expect(await words(figure(place, 'verdict'))).toContain('Not evaluated');
        for (const entry of edition.unmapped.filter((item) => item.what === 'space'))
          expect(await words(figure(place, 'unmapped'))).toContain(`${entry.name}: ${entry.type}`);
        continue;
      }
      expect(await words(figure(place, 'interior-allowance')), edition.edition).toBe(watts(result.allowanceW));
      expect(await words(figure(place, 'interior-installed'))).toBe(watts(result.installedW));
      expect(await words(figure(place, 'interior-margin'))).toContain(watts(result.marginW));
      // The words say what the figure says: within and what is left, or over by the excess.
      const margin = watts(String(Math.abs(Number(result.marginW))));
      expect(await words(figure(place, 'interior-margin-words'))).toBe(
        result.interiorComplies ? `within allowance, ${margin} to spare` : `over by ${margin}`,
      );
      expect(await words(figure(place, 'interior-status'))).toBe(result.interiorComplies ? 'Within allowance' : 'Over allowance');
      expect(await words(figure(place, 'area'))).toBe(area(result.area, result.units));
      if (result.exterior) {
        expect(await words(figure(place, 'exterior-allowance'))).toBe(watts(result.exterior.allowanceW));
        expect(await words(figure(place, 'exterior-installed'))).toBe(watts(result.exterior.installedW));
        expect(await words(figure(place, 'exterior-status'))).toBe(result.exterior.complies ? 'Within allowance' : 'Over allowance');
      }
      const notCounted = edition.unmapped.filter((item) => item.what === 'exterior application');
      for (const entry of notCounted) expect(await words(figure(place, 'exterior-not-counted'))).toContain(entry.name);
      const { met, notMet, toVerify } = result.controls;
      expect(await words(figure(place, 'control-counts'))).toBe(`${met} met · ${notMet} not met · ${toVerify} to verify`);
      const controls = await words(figure(place, 'controls'));
      for (const control of edition.controlsNotCarried) expect(controls).toContain(control);
      for (const change of edition.controlChanges.flatMap((entry) => entry.changes)) expect(controls).toContain(change.control);
      const unverified = await words(figure(place, 'unverified'));
      expect(unverified).toContain(result.unverifiedValues === 0 ? 'None' : `${result.unverifiedValues} value`);
    }
    // The demo changes controls under at least one edition: the lists are there to read.
    expect(all.some((edition) => edition.controlChanges.length > 0)).toBe(true);
    expect(await page.locator('[data-change="now-required"] li').count()).toBeGreaterThan(0);

    // No code-table key, field path or edition id on screen.
    const text = await page.locator('al-compare-page').innerText();
    for (const edition of all) expect(text).not.toContain(edition.edition);
    expect(text).not.toMatch(/spaces\.\d|controlChanges|not-required|to-verify|now-required/);
    await browser.screenshot('compare');
  });

  it('sets the editions side by side on a wide screen and stacks them as cards on a phone', async () => {
    const { page } = browser;
    const boxes = () =>
      columns(page).evaluateAll((nodes) => nodes.map((node) => node.getBoundingClientRect()).map(({ x, y, width }) => ({ x, y, width })));
    const wide = await boxes();
    // Side by side: one row of columns, each to the right of the one before.
    expect(new Set(wide.map((box) => Math.round(box.y))).size).toBe(1);
    for (let index = 1; index < wide.length; index++) expect(wide[index]!.x).toBeGreaterThan(wide[index - 1]!.x);
    // The first rows line up across the columns: the interior figures start at the same height.
    const tops = await page
      .locator('[data-figure="interior-allowance"]')
      .evaluateAll((nodes) => nodes.map((node) => Math.round(node.getBoundingClientRect().top)));
    expect(new Set(tops).size).toBe(1);

    // A phone held upright, 390 × 844 CSS pixels (common practice for a current mid-size phone).
    await page.setViewportSize({ width: 390, height: 844 });
    await expect.poll(async () => new Set((await boxes()).map((box) => Math.round(box.x))).size).toBe(1);
    const stacked = await boxes();
    for (let index = 1; index < stacked.length; index++) expect(stacked[index]!.y).toBeGreaterThan(stacked[index - 1]!.y);
    for (const box of stacked) expect(box.x + box.width).toBeLessThanOrEqual(390);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(1);
    await browser.screenshot('compare-phone');
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('prints every edition within the sheet, with the cautions and without the navigation', async () => {
    const { page } = browser;
    await page.emulateMedia({ media: 'print' });
    // A sheet of A4 at 96 px to the inch, less the page margins: what the print lays out.
    await page.setViewportSize({ width: 704, height: 1030 });
    await expect.poll(() => page.getByRole('navigation', { name: 'Project areas' }).isVisible()).toBe(false);
    expect(await page.getByRole('note', { name: 'Cautions' }).isVisible()).toBe(true);
    const rights = await columns(page).evaluateAll((nodes) => nodes.map((node) => node.getBoundingClientRect().right));
    expect(rights.length).toBe(1 + comparison.editions.length);
    for (const right of rights) expect(right).toBeLessThanOrEqual(704);
    for (const edition of [comparison.current, ...comparison.editions]) expect(await column(page, edition.edition).isVisible()).toBe(true);
    await browser.screenshot('print-compare');
    await page.setViewportSize({ width: 1280, height: 800 });
  });
});
