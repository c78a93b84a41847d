/// <reference lib="dom" />
import { readFileSync } from 'node:fs';
import path from 'node:path';
import JSZip from 'jszip';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { outputDir, type Browser, type Served } from '../support/browser.js';
import { closeStorageBrowserSuite, openStorageBrowserSuite, signInAs, type StorageBrowserSuite } from '../support/browser-suite.js';

let suite: StorageBrowserSuite;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  suite = await openStorageBrowserSuite();
  ({ served, browser } = suite);
  browser.page.setDefaultTimeout(30_000);
  // A phone held upright, 390 × 844 CSS pixels.
  await browser.page.setViewportSize({ width: 390, height: 844 });
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-field-test-photos-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(async () => {
  await closeStorageBrowserSuite(suite);
});

const signIn = (email: string) => signInAs(suite, email, inject('demoPassword'));

describe('field test photos on a phone', { timeout: 120_000 }, () => {
  it('lets the contractor add a photo to an item, see its thumbnail and download the record', async () => {
    const { page } = browser;
    await signIn('contractor@alderbay.example');
    const projects = (await (await page.request.get(`${served.baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
    const projectId = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id;
    await page.goto(`${served.baseUrl}/projects/${projectId}/field-tests`);
    const card = page.getByTestId('field-test-item').first();
    await card.waitFor();
    const photoFile = path.join(outputDir, 'field-test-photo-input.jpg');
    await sharp({ create: { width: 1200, height: 900, channels: 3, background: { r: 90, g: 140, b: 200 } } })
      .jpeg()
      .toFile(photoFile);
    await card.getByTestId('field-test-photo-input').setInputFiles(photoFile);
    const thumb = card.getByTestId('field-test-thumb');
    await thumb.waitFor();
    // The thumbnail loads lazily: once it is in view.
    await thumb.scrollIntoViewIfNeeded();
    await expect.poll(() => thumb.evaluate((image: HTMLImageElement) => image.complete && image.naturalWidth)).toBe(320);
    expect(await thumb.getAttribute('alt')).toMatch(/^Photo of the test: /);
    await browser.screenshot('field-test-photos-phone');

    const [file] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download the field test record' }).click(),
    ]);
    expect(file.suggestedFilename()).toBe('Alder Bay Library & Makerspace - field test record.docx');
    const saved = path.join(outputDir, 'field-test-record.docx');
    await file.saveAs(saved);
    const zip = await JSZip.loadAsync(readFileSync(saved));
    expect(await zip.file('word/document.xml')!.async('string')).toContain('Field test record');
    expect(Object.keys(zip.files).some((name) => name.startsWith('word/media/'))).toBe(true);
  });
});
