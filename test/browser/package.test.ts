/// <reference lib="dom" />
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { outputDir, type Browser, type Served } from '../support/browser.js';
import { closeStorageBrowserSuite, openStorageBrowserSuite, signInAs, type StorageBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';
import { pdfPageScreenshots } from '../support/pdf-pages.js';

let suite: StorageBrowserSuite;
let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl = '';
let projectId = '';

beforeAll(async () => {
  suite = await openStorageBrowserSuite();
  ({ database, served, browser } = suite);
  browser.page.setDefaultTimeout(30_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-package-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(async () => {
  await closeStorageBrowserSuite(suite);
});

const signIn = (email: string) => signInAs(suite, email, inject('demoPassword'));

const revisionCard = (page: Page, name: string) => page.getByTestId('package-revision').filter({ hasText: name });

/** Clicks a download link and answers the file's suggested name and its bytes. */
async function download(page: Page, card: ReturnType<typeof revisionCard>, label: string): Promise<{ name: string; bytes: Buffer }> {
  const [file] = await Promise.all([page.waitForEvent('download'), card.getByRole('link', { name: new RegExp(`^${label} `) }).click()]);
  const saved = path.join(outputDir, `package-${file.suggestedFilename().replace(/[^\w.-]+/g, '-')}`);
  await file.saveAs(saved);
  return { name: file.suggestedFilename(), bytes: readFileSync(saved) };
}

describe('the Package page', { timeout: 120_000 }, () => {
  it('lets the engineer make a draft package and download it', async () => {
    const { page } = browser;
    await signIn('engineer@alderbay.example');
    const projects = (await (await page.request.get(`${served.baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
    projectId = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id;
    projectUrl = `${served.baseUrl}/projects/${projectId}`;
    await page.goto(`${projectUrl}/package`);
    await page.getByText('No package has been made yet.').waitFor();
    await page.getByRole('button', { name: 'Make a draft package' }).click();
    const card = revisionCard(page, 'Revision 1 (draft)');
    await card.waitFor();
    const pdf = await download(page, card, 'PDF');
    expect(pdf.name).toBe('Alder Bay Library & Makerspace - submittal revision 1 (draft).pdf');
    // A PDF file starts with its header, "%PDF-" (ISO 32000-1 §7.5.2).
    expect(pdf.bytes.subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('makes the final package of the accepted design, which issues it', async () => {
    const { page } = browser;
    await database.db('projects').where({ id: projectId }).update({ state: 'accepted' });
    await page.goto(`${projectUrl}/package`);
    await page.getByRole('button', { name: 'Make the final package and issue the design' }).click();
    await revisionCard(page, 'Revision 2 (final)').waitFor();
    await expect.poll(async () => (await database.db('projects').where({ id: projectId }).first('state'))!.state).toBe('issued');
    await page.getByRole('button', { name: 'Make the final package again' }).waitFor();
    await page.getByRole('button', { name: 'Compare', exact: true }).click();
    await page.getByTestId('package-comparison').getByText('Both have the same fingerprint').waitFor();
    await browser.screenshot('package-page');
  });

  it('lets the contractor download the final package of the issued design, and shows no draft', async () => {
    const { page } = browser;
    await signIn('contractor@alderbay.example');
    await page.goto(`${projectUrl}/package`);
    const card = revisionCard(page, 'Revision 2 (final)');
    await card.waitFor();
    await expect.poll(() => page.getByTestId('package-revision').count()).toBe(1);
    expect(await page.getByRole('button', { name: /Make/ }).count()).toBe(0);
    const word = await download(page, card, 'Word');
    expect(word.name).toBe('Alder Bay Library & Makerspace - submittal revision 2.docx');
    // Word files are zip packages: "PK" first (ECMA-376 Part 2, Open Packaging Conventions).
    expect(word.bytes.subarray(0, 2).toString()).toBe('PK');
    await browser.screenshot('package-page-contractor');
    const pdf = await download(page, card, 'PDF');
    // The first two pages of the PDF as pdf.js draws them (pdfjs-dist, the reader Firefox uses).
    const { files, texts } = await pdfPageScreenshots(browser.context, pdf.bytes, [1, 2], 'package-pdf-page');
    expect(files).toHaveLength(2);
    expect(texts[0]).toContain('Alder Bay Library & Makerspace');
    expect(texts.join(' ')).not.toContain('DRAFT');
    for (const file of files) expect(readFileSync(file).length).toBeGreaterThan(10_000);
  });
});
