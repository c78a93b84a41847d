import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Express } from 'express';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const webDist = path.join(root, 'dist', 'web', 'browser');
export const outputDir = path.join(root, 'test-output', 'browser');

/** Flags that keep Debian's Chromium headless, sandbox-free as root, and off the network. */
const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export function requireBuiltWebApp(): void {
  if (!existsSync(path.join(webDist, 'index.html'))) {
    throw new Error(`The web app is not built (${webDist} is missing). Run \`npm test\`, or \`npx ng build\` first.`);
  }
}

export interface Served {
  baseUrl: string;
  close(): Promise<void>;
}

export function serve(app: Express): Promise<Served> {
  return new Promise((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({
        baseUrl: `http://127.0.0.1:${port}`,
        close: () => new Promise((done) => server.close(() => done())),
      });
    });
  });
}

export interface Browser {
  context: BrowserContext;
  page: Page;
  screenshot(name: string): Promise<string>;
  close(): Promise<void>;
}

/** Real Chromium from Debian's package, with a fresh profile that is removed afterwards. */
export async function launchBrowser(): Promise<Browser> {
  const profile = mkdtempSync(path.join(os.tmpdir(), 'allowlight-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    args: chromiumArgs,
    viewport: { width: 1280, height: 800 },
  });
  const page = context.pages()[0] ?? (await context.newPage());
  // Uncaught exceptions and console errors fail the file when the browser closes. Refused requests
  // (a 401 on a wrong password, a 409 on a stale write) are expected, and are the page's to show.
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(`uncaught: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) errors.push(`console: ${message.text()}`);
  });
  mkdirSync(outputDir, { recursive: true });
  return {
    context,
    page,
    async screenshot(name) {
      const file = path.join(outputDir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
      if (errors.length > 0) throw new Error(`The page reported errors:\n${errors.join('\n')}`);
    },
  };
}
