import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EvaluationResult } from '../../service/src/compliance/index.js';
import { evaluationResultSchema } from '../../service/src/evaluation/result.schema.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let engineer: SignedInAgent;
let projectId: string;
let result: EvaluationResult;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === 'Alder Bay Library & Makerspace').id;
  const response = await engineer.agent.get(`/api/projects/${projectId}/results`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  result = response.body;
});

afterAll(async () => {
  await database.drop();
});

function unmet(evaluation: EvaluationResult): string[] {
  return evaluation.interior.spaces.flatMap((space) =>
    space.controls.filter((line) => line.status === 'not-met').map((line) => `${space.name}: ${line.strategy} — ${line.reason}`),
  );
}

describe('the seeded demo project', () => {
  it('is a two-level library of about 18,000 ft² with 8–10 luminaire types and windows on the reading room and offices', async () => {
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
    expect(document).toMatchObject({ edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
    expect(document.spaces.length).toBeGreaterThanOrEqual(24);
    expect(new Set(document.spaces.map((space: { level: string }) => space.level))).toEqual(new Set(['Level 1', 'Level 2']));
    const area = document.spaces.reduce((total: number, space: { area: string }) => total + Number(space.area), 0);
    expect(area).toBeGreaterThan(16_000);
    expect(area).toBeLessThan(20_000);
    expect(document.luminaireTypes.length).toBeGreaterThanOrEqual(8);
    expect(document.luminaireTypes.length).toBeLessThanOrEqual(10);
    const withWindows = document.spaces
      .filter((space: { windows: unknown[] }) => space.windows.length > 0)
      .map((space: { name: string }) => space.name);
    expect(withWindows).toEqual(expect.arrayContaining(['102 Main reading room', '203 Office']));
    expect(document.exterior.applications.map((application: { key: string }) => application.key)).toEqual(
      expect.arrayContaining(['parking-lots-and-drives', 'entry-canopies']),
    );
  });

  it('complies, inside and out, with a modest margin', () => {
    expect(unmet(result)).toEqual([]);
    const open = result.interior.spaces.flatMap((space) =>
      space.controls.filter((line) => line.status === 'to-verify').map((line) => `${space.name}: ${line.reason}`),
    );
    expect(open).toEqual([]);
    expect(result.openItems).toEqual({ spacesWithoutLuminaires: 0, controlsToVerify: 0 });
    expect(result.interior.complies).toBe(true);
    expect(result.exterior?.complies).toBe(true);
    expect(result.complies).toBe(true);
    const margin = Number(result.interior.marginPct);
    expect(margin).toBeGreaterThan(5);
    expect(margin).toBeLessThan(15);
  });

  it('records the glazing of every window, so no daylight line waits on a blank', async () => {
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
    const windows = document.spaces.flatMap(
      (space: { windows: { visibleTransmittance?: string; daylightBlocked?: boolean }[] }) => space.windows,
    );
    expect(windows.length).toBeGreaterThan(0);
    for (const window of windows) expect(window).toMatchObject({ visibleTransmittance: expect.any(String), daylightBlocked: false });
    const daylightLines = result.interior.spaces.flatMap((space) => space.controls.filter((line) => line.strategy.startsWith('daylight-')));
    expect(daylightLines.filter((line) => line.reason.includes('is not recorded'))).toEqual([]);
  });

  it('matches the served result schema', () => {
    const parsed = evaluationResultSchema.safeParse(result);
    expect(parsed.success, JSON.stringify(parsed.error?.issues.slice(0, 3))).toBe(true);
  });

  it('cites each unverified value in words: edition, table or section, what it rests on, and a note without the files’ markers', () => {
    expect(result.unverifiedValues.length).toBeGreaterThan(0);
    for (const value of result.unverifiedValues) {
      expect(value.citation.checked, value.what).toBe(false);
      expect(value.source, value.what).toBe(value.citation.short);
      expect(value.source, value.what).toMatch(/^IECC 2021 /);
      expect(`${value.what} ${value.source} ${value.note}`, value.what).not.toMatch(
        /\[(S|S-ed|I|M)\b|FLAG:|source annotation|SOURCES\.md|github:|https?:\/\/|from memory/i,
      );
    }
    // IECC 2021 C405.2.2 time-switch control: the reference data follows Washington's state text (WAC 51-11C-405022).
    expect(result.unverifiedValues.find((value) => value.what === 'Control strategy: Time-switch control')?.citation).toMatchObject({
      layer: 'other-edition-or-state',
      short: 'IECC 2021 Section C405.2.2 — Washington state text standing in for the model code',
    });
  });

  it('gives the same result when its document is evaluated directly', async () => {
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
    const evaluated = await engineer.agent.post('/api/evaluate').set('X-CSRF-Token', engineer.csrfToken).send(document);
    expect(evaluated.status).toBe(200);
    expect(evaluated.body).toEqual(result);
  });
});
