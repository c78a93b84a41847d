import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

/** The workspace follows changes made elsewhere: here, the engineer writing through the API while the reviewer's page is open. */
let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectId: string;
let engineer: { cookie: string; csrf: string };

interface StoredSpace {
  id: string;
  name: string;
  version: number;
  controls: unknown[];
}

async function asEngineer(method: string, path: string, body?: unknown): Promise<Response> {
  return fetch(`${served.baseUrl}${path}`, {
    method,
    headers: { Cookie: engineer.cookie, 'X-CSRF-Token': engineer.csrf, 'Content-Type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

async function spaces(): Promise<StoredSpace[]> {
  return (await (await asEngineer('GET', `/api/projects/${projectId}/spaces`)).json()) as StoredSpace[];
}

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const login = await fetch(`${served.baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@alderbay.example', password: inject('demoPassword') }),
  });
  expect(login.status).toBe(200);
  engineer = {
    cookie: login.headers
      .getSetCookie()
      .map((line) => line.split(';')[0])
      .join('; '),
    csrf: ((await login.json()) as { csrfToken: string }).csrfToken,
  };
  const projects = (await (await asEngineer('GET', '/api/projects')).json()) as { id: string; name: string }[];
  projectId = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id;

  const { page } = browser;
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('reviewer@alderbay.example');
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('the workspace follows changes made elsewhere', () => {
  it('shows a space the engineer renamed through the API, without a reload', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/projects/${projectId}/spaces`);
    const [first] = await spaces();
    await page.locator('[data-space-id]', { hasText: first!.name }).first().waitFor();
    await expect.poll(() => page.getByTestId('workspace-verdict').textContent()).toContain('Complies');

    const renamed = await asEngineer('PATCH', `/api/projects/${projectId}/spaces/${first!.id}`, {
      version: first!.version,
      name: 'Renamed while the reviewer watched',
    });
    expect(renamed.status).toBe(200);
    await page.locator(`[data-space-id="${first!.id}"]`, { hasText: 'Renamed while the reviewer watched' }).first().waitFor();
    expect(page.url()).toContain('/spaces');
  });

  it('recomputes the verdict when the engineer takes a required control away', async () => {
    const { page } = browser;
    const withControls = (await spaces()).find((space) => space.controls.length > 0)!;
    const removed = await asEngineer('PATCH', `/api/projects/${projectId}/spaces/${withControls.id}`, {
      version: withControls.version,
      controls: [],
    });
    expect(removed.status).toBe(200);
    await expect.poll(() => page.getByTestId('workspace-verdict').textContent()).toContain('Does not comply');
  });
});
