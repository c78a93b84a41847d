/// <reference lib="dom" />
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import ExcelJS from 'exceljs';
import type { Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let scratch: string;
let projectId = '';
let bayId = '';
let storeId = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
  scratch = mkdtempSync(path.join(os.tmpdir(), 'allowlight-design-entry-'));
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-design-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(async () => {
  await closeBrowserSuite({ browser, served, database });
  if (scratch) rmSync(scratch, { recursive: true, force: true });
});

const api = (route: string) => `${served.baseUrl}/api${route}`;
const projectUrl = (page: string) => `${served.baseUrl}/projects/${projectId}/${page}`;

async function csrf(page: Page): Promise<string> {
  return ((await (await page.request.get(api('/auth/me'))).json()) as { csrfToken: string }).csrfToken;
}

async function send<T>(page: Page, method: 'post' | 'patch', route: string, data: unknown): Promise<T> {
  const response = await page.request[method](api(route), { headers: { 'X-CSRF-Token': await csrf(page) }, data });
  expect(response.ok(), `${method} ${route}: ${await response.text()}`).toBe(true);
  return (await response.json()) as T;
}

/** Results have settled when no page shows the "updating" notice. */
async function settled(page: Page): Promise<void> {
  await expect.poll(() => page.getByText(/Updating results…/).count()).toBe(0);
}

/** A label that fits shows all its text; one cut off with an ellipsis is wider inside than out. */
async function cutLabels(dialog: Locator): Promise<string[]> {
  return dialog
    .locator('mat-label, .mdc-floating-label')
    .evaluateAll((labels) =>
      labels
        .filter((label) => label.scrollWidth > label.clientWidth + 1 && getComputedStyle(label).display !== 'none')
        .map((label) => label.textContent?.trim() ?? ''),
    );
}

/** A hint or error that runs into another field's box (where the next field's label sits). */
async function overlappingHints(dialog: Locator): Promise<string[]> {
  return dialog.evaluate((root) => {
    const fields = Array.from(root.querySelectorAll('mat-form-field'));
    const found: string[] = [];
    for (const field of fields) {
      for (const hint of Array.from(field.querySelectorAll('mat-hint, mat-error'))) {
        const box = hint.getBoundingClientRect();
        for (const other of fields) {
          if (other === field) continue;
          const flex = (other.querySelector('.mat-mdc-text-field-wrapper') ?? other).getBoundingClientRect();
          const apart = box.right <= flex.left || box.left >= flex.right || box.bottom <= flex.top || box.top >= flex.bottom;
          if (!apart) found.push(hint.textContent?.trim() ?? '');
        }
      }
    }
    return found;
  });
}

describe('an engineer enters a fire station', { timeout: 90_000 }, () => {
  it('sets up a project with a toplit apparatus bay through the API', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();

    // An invented fire station; its space types are rows of IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data.
    projectId = (
      await send<{ id: string }>(page, 'post', '/projects', {
        name: 'Fire Station 4',
        edition: 'iecc-2021',
        method: 'space-by-space',
        units: 'ip',
        lightingZone: 2,
      })
    ).id;
    // Invented schedule: a high-bay of about 150 W.
    await send(page, 'post', `/projects/${projectId}/luminaire-types`, {
      tag: 'H1',
      description: 'LED high-bay',
      inputWatts: '151.5',
      use: 'general',
      wattageSource: 'Invented demo value',
    });
    // A 60 × 50 ft bay (3,000 ft²) under a 24 ft ceiling with one 8 × 8 ft skylight in the middle.
    const bay = await send<{ id: string }>(page, 'post', `/projects/${projectId}/spaces`, {
      name: 'Apparatus bay',
      level: 'Level 1',
      spaceType: 'emergency-vehicle-garage',
      area: '3000',
      length: '60',
      width: '50',
      ceilingHeight: '24',
      luminaires: [{ tag: 'H1', count: '10' }],
      skylights: [{ length: '8', width: '8' }],
    });
    bayId = bay.id;
    storeId = (
      await send<{ id: string }>(page, 'post', `/projects/${projectId}/spaces`, {
        name: 'Hose store',
        level: 'Level 1',
        spaceType: 'storage-room',
        area: '200',
      })
    ).id;
  });

  it('splits the high-bays into the toplit zone on Luminaires › Counts, and the Daylight and Controls pages require toplighting control', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl('daylight')}?space=${bayId}`);
    const toplit = page.locator('.zone-card[data-kind="toplit"]');
    await toplit.waitFor();
    await settled(page);
    await browser.screenshot('design-daylight-before-split');

    // The Daylight page says where zones are assigned, and its link opens the space's counts.
    await page.getByRole('link', { name: 'assign them under Luminaires › Counts' }).click();
    await page.waitForURL(/\/luminaires\?tab=counts&space=/);
    await expect.poll(() => page.getByRole('tab', { name: 'Counts' }).getAttribute('aria-selected')).toBe('true');
    const panel = page.getByRole('region', { name: 'Apparatus bay' });
    await panel.getByRole('heading', { name: 'Apparatus bay' }).waitFor();
    expect(await cutLabels(panel)).toEqual([]);

    // A reload would lose this mark; a save through the service keeps the page.
    await page.evaluate(() => ((window as unknown as { stillHere: boolean }).stillHere = true));
    await panel.getByRole('combobox', { name: 'Daylight zone' }).click();
    await page.getByRole('option', { name: 'Toplit' }).click();
    await browser.screenshot('design-counts-split');
    await panel.getByRole('button', { name: 'Save counts' }).click();
    await expect.poll(() => panel.getByRole('button', { name: 'Save counts' }).isDisabled()).toBe(true);
    const stored = async () =>
      ((await (await page.request.get(api(`/projects/${projectId}/spaces/${bayId}`))).json()) as { luminaires: { zone?: string }[] })
        .luminaires;
    await expect.poll(async () => (await stored())[0]?.zone).toBe('toplit');
    expect(await page.evaluate(() => (window as unknown as { stillHere?: boolean }).stillHere)).toBe(true);
    expect(page.url()).toContain('tab=counts');
    expect(await page.getByRole('tab', { name: 'Counts' }).getAttribute('aria-selected')).toBe('true');

    await page.getByRole('link', { name: 'Daylight' }).click();
    await page.getByRole('button', { name: /Apparatus bay/ }).click();
    await settled(page);
    // All ten in the toplit zone: 10 × 151.5 W = 1,515 W, over the edition data's 150 W threshold for
    // toplighting control (IECC 2021 C405.2.4, from memory in reference/iecc-2021/rules.json).
    await expect.poll(() => toplit.textContent()).toContain('1,515');
    await expect.poll(() => toplit.textContent()).toContain('Toplighting control required');
    await browser.screenshot('design-daylight-after-split');

    await page.goto(`${projectUrl('controls')}?space=${bayId}`);
    await settled(page);
    const line = page.locator('article[data-strategy="daylight-toplighting"]');
    await expect.poll(() => line.textContent()).toContain('Required ·');
    expect(await line.textContent()).toContain('Not met');
    await browser.screenshot('design-controls-toplighting');
  });

  it('says beside a count cell why it refused a value, and puts the count back on Esc', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl('luminaires')}?tab=counts`);
    const cell = page.getByRole('textbox', { name: 'H1 in Hose store', exact: true });
    await cell.fill('2.5');
    await cell.press('Enter');
    const reason = page.getByRole('alert').filter({ hasText: 'Must be a whole number' });
    await reason.waitFor();
    expect(await reason.textContent()).toContain('Enter a whole number from 0 to 1,000,000.');
    expect(await cell.inputValue()).toBe('2.5');
    expect(await cell.getAttribute('aria-invalid')).toBe('true');
    await browser.screenshot('design-count-refused');
    await cell.press('Escape');
    await expect.poll(() => cell.inputValue()).toBe('');
    await reason.waitFor({ state: 'detached' });
    expect(await cell.getAttribute('aria-invalid')).toBeNull();
  });

  it('confirms a space without luminaires as unlit, and keeps its building area type for the other method', async () => {
    const { page } = browser;
    await page.goto(projectUrl('spaces'));
    await page.getByRole('button', { name: 'Edit Hose store' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('checkbox', { name: 'No lighting in this space' }).waitFor();
    await dialog.getByText('For the other compliance method').click();
    await dialog.getByRole('combobox', { name: 'Building area type' }).click();
    await page.getByRole('option', { name: /^Fire station/ }).click();
    await dialog.getByRole('checkbox', { name: 'No lighting in this space' }).check();
    for (const width of [1280, 820]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await cutLabels(dialog)).toEqual([]);
      expect(await overlappingHints(dialog)).toEqual([]);
      await browser.screenshot(`design-space-dialog-${width}`);
    }
    await page.setViewportSize({ width: 1280, height: 800 });
    await dialog.getByRole('button', { name: 'Save space' }).click();
    await dialog.waitFor({ state: 'detached' });
    const stored = (await (await page.request.get(api(`/projects/${projectId}/spaces/${storeId}`))).json()) as {
      unlit?: boolean;
      spaceType?: string;
      buildingAreaType?: string;
    };
    expect(stored).toMatchObject({ unlit: true, spaceType: 'storage-room', buildingAreaType: 'fire-station' });
  });

  it('shows every label of the luminaire dialog whole, with no hint over the next field, at 1280 and 820 px', async () => {
    const { page } = browser;
    await page.goto(projectUrl('luminaires'));
    // Rated input to 0.1 W, with the product columns.
    await page.getByRole('cell', { name: '151.5', exact: true }).waitFor();
    // Each type's cut sheet has its column; none is on file for this project yet.
    await page.getByRole('columnheader', { name: 'Cut sheet' }).waitFor();
    await page.getByRole('row').filter({ hasText: 'H1' }).getByText('None on file').waitFor();
    await page.getByRole('button', { name: 'Edit type H1' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Manufacturer').fill('Invented Lighting Co.');
    await dialog.getByLabel('Catalogue number').fill('HB-150-40K');
    await dialog.getByLabel('Light source').fill('LED, 4000 K');
    await dialog.getByLabel('Driver').fill('0–10 V dimming');
    await dialog.getByLabel('Voltage').fill('120–277 V');
    for (const width of [1280, 820]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await cutLabels(dialog)).toEqual([]);
      expect(await overlappingHints(dialog)).toEqual([]);
      await browser.screenshot(`design-luminaire-dialog-${width}`);
    }
    await page.setViewportSize({ width: 1280, height: 800 });
    await dialog.getByRole('button', { name: 'Save type' }).click();
    await dialog.waitFor({ state: 'detached' });
    const row = page.getByRole('row').filter({ hasText: 'LED high-bay' });
    await expect.poll(() => row.textContent()).toContain('HB-150-40K');
    for (const text of ['Invented Lighting Co.', 'LED, 4000 K', '0–10 V dimming', '120–277 V'])
      expect(await row.textContent()).toContain(text);
    await browser.screenshot('design-luminaire-schedule');
  });

  it('imports spaces, a luminaire type and counts from a workbook, with an unknown type name matched in the dialog and remembered', async () => {
    const { page } = browser;
    async function workbook(name: string, rooms: (string | number)[][], withTypes: boolean): Promise<string> {
      const book = new ExcelJS.Workbook();
      const sheet = book.addWorksheet('Rooms');
      sheet.addRow(['Room', 'Level', 'Space type', 'Area (ft²)', 'H1', 'T1']);
      rooms.forEach((row) => sheet.addRow(row));
      if (withTypes) {
        const types = book.addWorksheet('Luminaire types');
        types.addRow(['Tag', 'Description', 'Rated input (W)', 'Use']);
        // Invented schedule value.
        types.addRow(['T1', '4 ft LED strip', 32.5, 'General lighting']);
      }
      const file = path.join(scratch, name);
      await book.xlsx.writeFile(file);
      return file;
    }
    // Invented rooms. "Corr", "RR" and "Mech/Elec rm" are short forms for rows of IECC 2021 Table C405.3.2(2)
    // (via PNNL building-energy-standards-data); "Apparatus bay" is no row's name.
    const first = await workbook(
      'station.xlsx',
      [
        ['Bay 2', 'Level 1', 'Apparatus bay', 2800, 8, ''],
        ['Hall 1', 'Level 1', 'Corr', 400, '', 4],
        ['WC 1', 'Level 1', 'RR', 60, '', 1],
        ['Mech 1', 'Level 1', 'Mech/Elec rm', 120, '', 2],
      ],
      true,
    );
    await page.goto(projectUrl('spaces'));
    // The dialog takes the project's luminaire types as they are when it opens: open it on a loaded project.
    await page.locator('[data-space-id]', { hasText: 'Hose store' }).first().waitFor();
    await expect.poll(() => page.getByTestId('workspace-verdict').textContent()).not.toContain('Updating');
    await page.getByRole('button', { name: 'Import spreadsheet' }).click();
    await page.getByTestId('import-file').setInputFiles(first);
    await page.getByText('Spaces: station.xlsx, 4 rows').waitFor();
    await expect.poll(() => page.getByRole('combobox', { name: 'Luminaire types from' }).textContent()).toContain('Luminaire types');
    // Both count columns are read as counts of their type: the project's H1 and the workbook's T1.
    for (const tag of ['H1', 'T1'])
      await expect
        .poll(() => page.getByRole('combobox', { name: `Field for column ${tag}`, exact: true }).textContent())
        .toContain(`Count of type ${tag}`);
    await browser.screenshot('design-import-columns');
    await page.getByRole('button', { name: 'Check rows' }).click();
    await page.getByText('1 row with problems').waitFor();
    await page.locator('al-space-import-name-picker').getByText('“Apparatus bay”').waitFor();
    const picker = page.getByRole('combobox', { name: 'Space type it means' });
    await picker.fill('vehicle');
    await page.getByRole('option', { name: 'Emergency Vehicle Garage' }).click();
    await page.getByText('all ready to import').waitFor();
    await browser.screenshot('design-import-preview');
    const preview = page.getByRole('table', { name: 'Rows to import' });
    await preview.scrollIntoViewIfNeeded();
    await preview.getByText('from “Corr”').waitFor();
    await preview.getByRole('row').filter({ hasText: 'Bay 2' }).getByText('H1 × 8').waitFor();
    await browser.screenshot('design-import-preview-rows');
    await page.getByRole('button', { name: 'Import 4 spaces' }).click();
    await page.getByText('4 spaces imported with 1 luminaire type').waitFor();

    const spaces = (await (await page.request.get(api(`/projects/${projectId}/spaces`))).json()) as {
      name: string;
      spaceType: string;
      luminaires: { tag: string; count: string }[];
    }[];
    const byName = new Map(spaces.map((space) => [space.name, space]));
    expect(byName.get('Bay 2')).toMatchObject({ spaceType: 'emergency-vehicle-garage', luminaires: [{ tag: 'H1', count: '8' }] });
    expect(byName.get('Hall 1')).toMatchObject({ spaceType: 'corridor-otherwise', luminaires: [{ tag: 'T1', count: '4' }] });
    expect(byName.get('WC 1')?.spaceType).toBe('restroom-otherwise');
    expect(byName.get('Mech 1')?.spaceType).toBe('electrical-mechanical-room');

    await page.getByRole('link', { name: 'Luminaires' }).click();
    await page.getByRole('cell', { name: '32.5', exact: true }).waitFor();
    await page.getByRole('tab', { name: 'Counts' }).click();
    await expect.poll(() => page.getByRole('textbox', { name: 'T1 in Hall 1', exact: true }).inputValue()).toBe('4');
    await browser.screenshot('design-import-counts');

    // The next import of the same name needs no matching: the project remembered it.
    const second = await workbook('annex.xlsx', [['Bay 3', 'Level 1', 'APPARATUS-BAY', 2600, 6, '']], false);
    await page.getByRole('link', { name: 'Spaces' }).click();
    await page.getByRole('button', { name: 'Import spreadsheet' }).click();
    await page.getByTestId('import-file').setInputFiles(second);
    await page.getByRole('button', { name: 'Check rows' }).click();
    await page.getByText('all ready to import').waitFor();
    expect(await page.getByText('Names to match').count()).toBe(0);
    await page.getByRole('button', { name: 'Import 1 space' }).click();
    await page.getByText('1 space imported').waitFor();
  });
});
