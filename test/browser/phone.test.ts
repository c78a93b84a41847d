/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(20_000);
  // A phone held upright, 390 × 844 CSS pixels (common practice for a current mid-size phone).
  await browser.page.setViewportSize({ width: 390, height: 844 });
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-phone-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

/**
 * Parts of the page that stick out past the screen's edge, or that clip or scroll their content
 * sideways: each is narrower than its content needs. Only the outermost of each is named.
 */
async function crampedParts(): Promise<string[]> {
  return browser.page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const found: string[] = [];
    const reported: Element[] = [];
    const describe = (element: Element) =>
      `${element.tagName.toLowerCase()}.${[...element.classList].join('.')} “${(element.textContent ?? '').trim().slice(0, 40)}”`;
    for (const element of document.querySelectorAll('.content *')) {
      // Typed text scrolls in its field and a select shows its choice; a tab not shown is moved aside;
      // a pressed control's ripple is a decoration that clips its own wave while it fades.
      if (
        element.closest(
          'input, textarea, .mat-mdc-select, svg, canvas, .mat-ripple, mat-tab-body:not(.mat-mdc-tab-body-active), .mat-drawer:not(.mat-drawer-opened)',
        )
      )
        continue;
      if (reported.some((outer) => outer.contains(element))) continue;
      const style = getComputedStyle(element);
      if (style.display === 'none' || style.visibility === 'hidden') continue;
      // Kept for screen readers only (clipped to a pixel), like a card list's column headers.
      if (style.clip !== 'auto' && style.position === 'absolute') {
        reported.push(element);
        continue;
      }
      const rect = element.getBoundingClientRect();
      if (rect.width === 0 || rect.height === 0) continue;
      if (rect.right > width + 1 || rect.left < -1) found.push(`${describe(element)} sticks out`);
      else if (style.overflowX !== 'visible' && element.scrollWidth > element.clientWidth + 1)
        found.push(`${describe(element)} is narrower than its content`);
      else continue;
      reported.push(element);
    }
    return found;
  });
}

const sidewaysScroll = () => browser.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

describe('the demo on a phone (390 × 844)', { timeout: 60_000 }, () => {
  it('lists the projects as cards', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: 'Alder Bay Library & Makerspace' }).waitFor();
    // A card names each value beside it, from its column's header.
    await page.locator('td[data-label="Edition"]', { hasText: 'IECC 2021' }).first().waitFor();
    await browser.screenshot('phone-projects');
    expect(await sidewaysScroll()).toBeLessThanOrEqual(1);
    expect(await crampedParts()).toEqual([]);
    await page.getByRole('link', { name: 'Alder Bay Library & Makerspace' }).click();
    await page.getByRole('heading', { name: 'Spaces', level: 2 }).waitFor();
  });

  const areas: [string, string][] = [
    ['Set-up', 'setup'],
    ['Spaces', 'spaces'],
    ['Luminaires', 'luminaires'],
    ['Allowances', 'allowances'],
    ['Controls', 'controls'],
    ['Daylight', 'daylight'],
    ['Exterior', 'exterior'],
    ['Results', 'results'],
    ['Review', 'review'],
    ['Compare', 'compare'],
    ['Package', 'package'],
    ['Field tests', 'field-tests'],
    ['History', 'history'],
  ];
  for (const [label, path] of areas) {
    it(`opens ${label} from the menu and lays it out within the screen`, async () => {
      const { page } = browser;
      // The navigation is folded away: the page has the whole width.
      expect(await page.getByRole('navigation', { name: 'Project areas' }).count()).toBe(0);
      expect(await page.getByRole('link', { name: label, exact: true }).isVisible()).toBe(false);
      await page.getByRole('button', { name: 'Project areas' }).click();
      const link = page.getByRole('link', { name: label, exact: true });
      // Slid fully in (a trial click waits for the link to stand still).
      await link.click({ trial: true });
      if (path === 'setup') await browser.screenshot('phone-menu');
      await link.click();
      await page.waitForURL(new RegExp(`/${path}$`));
      // The menu closes on its own, and the bar names the area.
      await expect.poll(() => link.isVisible()).toBe(false);
      await expect.poll(() => page.locator('.area-bar').textContent()).toContain(label);
      await expect.poll(() => page.getByTestId('workspace-verdict').textContent(), { timeout: 20_000 }).toContain('Complies');
      // The history arrives apart from the design: wait for its entries.
      if (path === 'history') await page.locator('.entry').first().waitFor();
      if (path === 'results') await page.locator('td[data-label="Allowance (W)"]').first().waitFor();
      if (path === 'compare') await page.getByTestId('edition-column').first().waitFor();
      if (path === 'field-tests') {
        // Each kind folded to its heading on a phone: the first opened, so its cards are laid out too.
        await page.getByTestId('field-test-kind').first().click();
        await page.getByTestId('field-test-item').first().waitFor();
      }
      if (path === 'review') await page.locator('al-review-page').locator('.item-list, p.empty, p.failure').first().waitFor();
      await browser.screenshot(`phone-${path}`);
      expect(await sidewaysScroll()).toBeLessThanOrEqual(1);
      expect(await crampedParts()).toEqual([]);
    });
  }

  it('shows each space as a card with its figures named', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Project areas' }).click();
    await page.getByRole('link', { name: 'Spaces', exact: true }).click();
    const lobby = page.locator('[data-space-id]', { hasText: '101 Entry lobby' });
    await lobby.waitFor();
    // Each card is as tall as its content: name, type, the two figures and the status, one under the other.
    const box = await lobby.boundingBox();
    expect(box!.height).toBeGreaterThan(100);
    expect(await lobby.locator('[data-label="Allowance (W)"]').isVisible()).toBe(true);
    expect(await lobby.locator('.type').isVisible()).toBe(true);
  });

  /** How far the counts' list, the tab that holds it and the document scroll sideways (0 when all fits). */
  const countsOverflow = () =>
    browser.page.evaluate(() => {
      const overflow = (element: Element | null) => (element ? element.scrollWidth - element.clientWidth : Number.NaN);
      const list = document.querySelector('[role="list"][aria-label="Luminaire counts by space"]');
      return {
        list: overflow(list),
        grid: overflow(list?.closest('al-count-grid') ?? null),
        tab: overflow(list?.closest('.mat-mdc-tab-body-content') ?? null),
        document: overflow(document.documentElement),
      };
    });

  it('lists the luminaire counts as a card per space that fits the screen, reaches the daylight split, and keeps a changed count', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Project areas' }).click();
    await page.getByRole('link', { name: 'Luminaires', exact: true }).click();
    await page.getByRole('tab', { name: 'Counts' }).click();
    const list = page.getByRole('list', { name: 'Luminaire counts by space' });
    const lobby = list.getByRole('group', { name: '101 Entry lobby' });
    await lobby.waitFor();
    // The demo's first space (schema/seeds/demo-project.ts): 600 ft², 24 downlights and 2 exit signs.
    expect(await lobby.textContent()).toContain('600 ft²');
    expect(await page.getByRole('grid').count()).toBe(0);
    await browser.screenshot('phone-luminaire-counts');
    expect(await countsOverflow()).toEqual({ list: 0, grid: 0, tab: 0, document: 0 });
    expect(await crampedParts()).toEqual([]);

    // Each type is a labelled field: tag, description and its watts (the demo's schedule).
    const downlights = lobby.getByRole('textbox', { name: 'D 6 in LED downlight 13.0 W each' });
    expect(await downlights.inputValue()).toBe('24');
    expect(await lobby.getByRole('textbox', { name: /^A 2×4 LED troffer, 4000 K/ }).inputValue()).toBe('');

    // A refused count stays with its reason, and nothing is sent.
    await downlights.fill('2.5');
    await downlights.press('Enter');
    const problem = page.getByRole('alert').filter({ hasText: 'Must be a whole number' });
    await problem.waitFor();
    await problem.getByRole('button', { name: 'Keep 24' }).click();
    await expect.poll(() => downlights.inputValue()).toBe('24');
    expect(await problem.count()).toBe(0);

    // The daylight-zone split: the space's panel takes the list's place and fits the screen too.
    await list.getByRole('button', { name: 'Daylight zones of 102 Main reading room' }).click();
    const panel = page.getByRole('region', { name: '102 Main reading room' });
    await panel.waitFor();
    expect(await list.count()).toBe(0);
    expect(await panel.getByRole('combobox', { name: 'Daylight zone' }).count()).toBeGreaterThan(0);
    await browser.screenshot('phone-luminaire-counts-space');
    expect(await sidewaysScroll()).toBeLessThanOrEqual(1);
    expect(await crampedParts()).toEqual([]);
    await panel.getByRole('button', { name: "Close the space's counts" }).click();
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label')))
      .toBe('Daylight zones of 102 Main reading room');

    // A changed count is saved as the field is left: the card's total follows the stored space.
    await downlights.fill('25');
    await downlights.press('Enter');
    await expect.poll(() => lobby.locator('.card-detail').textContent()).toBe('Level 1 · 27 luminaires');
    await page.reload();
    await lobby.waitFor();
    expect(await downlights.inputValue()).toBe('25');
    expect(await lobby.locator('.card-detail').textContent()).toBe('Level 1 · 27 luminaires');
  });
});
