import { createHash } from 'node:crypto';
import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ProjectState } from '../../contract/review.js';
import { freePort } from '../../service/ops/postgres.mjs';
import { localS3Credentials } from '../../service/ops/s3-server.mjs';
import { figure } from '../../service/src/package/package-pdf.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { startTestS3, type TestS3 } from '../support/s3.js';

let database: TestDatabase;
let s3: TestS3;
let app: Express;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let contractor: SignedInAgent;
let projectId: string;

// The seeded demo project: its name has an ampersand, which the download's file name must carry.
const demoName = 'Alder Bay Library & Makerspace';

interface Made {
  id: string;
  revision: number;
  draft: boolean;
  fingerprint: string;
  files: { format: 'docx' | 'xlsx' | 'pdf'; url: string }[];
}

beforeAll(async () => {
  database = await freshDatabase();
  s3 = await startTestS3();
  ({ app } = testApp(database.db, database.url, s3.settings));
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === demoName).id;
});

afterAll(async () => {
  await s3?.stop();
  await database?.drop();
});

async function makePackage(who: SignedInAgent = engineer) {
  return who.agent.post(`/api/projects/${projectId}/packages`).set('X-CSRF-Token', who.csrfToken);
}

async function putInState(state: ProjectState): Promise<void> {
  await database.db('projects').where({ id: projectId }).update({ state });
}

function download(who: SignedInAgent, url: string) {
  return who.agent.get(url).responseType('blob');
}

async function stored(key: string): Promise<Buffer> {
  const client = new S3Client({ endpoint: s3.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: localS3Credentials });
  const answer = await client.send(new GetObjectCommand({ Bucket: s3.bucket, Key: key }));
  return Buffer.from(await answer.Body!.transformToByteArray());
}

async function pdfPages(data: Buffer): Promise<string[]> {
  const pdf = await getDocument({ data: new Uint8Array(data), useSystemFonts: false, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let number = 1; number <= pdf.numPages; number += 1) {
    const content = await (await pdf.getPage(number)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(''));
  }
  await pdf.destroy();
  return pages;
}

let draft: Made;
let final: Made;

describe('submittal packages', () => {
  it('makes a draft package of a draft design, with its three files stored and listed', { timeout: 90_000 }, async () => {
    expect((await database.db('projects').where({ id: projectId }).first('state'))!.state).toBe('draft');
    const response = await makePackage();
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    draft = response.body;
    expect(draft).toMatchObject({ revision: 1, draft: true });
    expect(draft.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    expect(draft.files.map((file) => file.format).sort()).toEqual(['docx', 'pdf', 'xlsx']);
    const listed = (await engineer.agent.get(`/api/projects/${projectId}/packages`)).body.revisions;
    expect(listed).toHaveLength(1);
    expect(listed[0]).toMatchObject({ id: draft.id, revision: 1, draft: true, fingerprint: draft.fingerprint, madeBy: engineer.user.name });
    // Making a draft does not move the review state.
    expect((await database.db('projects').where({ id: projectId }).first('state'))!.state).toBe('draft');
  });

  it('downloads each file byte for byte as stored, named after the project and the revision', async () => {
    const row = await database.db('package_revisions').where({ id: draft.id }).first();
    for (const file of draft.files) {
      const response = await download(engineer, file.url);
      expect(response.status).toBe(200);
      const record = row!.files.find((entry) => entry.format === file.format)!;
      const body = response.body as Buffer;
      expect(body.equals(await stored(record.key))).toBe(true);
      expect(createHash('sha256').update(body).digest('hex')).toBe(record.sha256);
      expect(body.length).toBe(record.size);
      // RFC 6266 with RFC 8187's filename* for the name as written.
      expect(response.headers['content-disposition']).toBe(
        `attachment; filename="${demoName} - submittal revision 1 (draft).${file.format}"; ` +
          `filename*=UTF-8''Alder%20Bay%20Library%20%26%20Makerspace%20-%20submittal%20revision%201%20%28draft%29.${file.format}`,
      );
    }
    const types = Object.fromEntries(
      await Promise.all(draft.files.map(async (file) => [file.format, (await download(engineer, file.url)).headers['content-type']])),
    );
    expect(types['pdf']).toBe('application/pdf');
    // The Word and Excel files are zip packages (PK, ECMA-376 Part 2).
    expect((await download(engineer, draft.files.find((file) => file.format === 'docx')!.url)).body.subarray(0, 2).toString()).toBe('PK');
  });

  it('prints the project name and the fingerprint on every page of the PDF, and the draft mark', async () => {
    const pdf = (await download(engineer, draft.files.find((file) => file.format === 'pdf')!.url)).body as Buffer;
    const pages = await pdfPages(pdf);
    expect(pages.length).toBeGreaterThan(1);
    for (const page of pages) {
      expect(page).toContain(draft.fingerprint);
      expect(page).toContain(demoName);
      expect(page).toContain('DRAFT — not for permit');
    }
    // The building's totals as the engine computes them, in the PDF's own rounding.
    const result = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    const text = pages.join('');
    for (const total of [result.interior.allowanceW, result.interior.installedW, result.exterior.allowanceW]) {
      expect(text).toContain(figure(total, 'W'));
    }
  });

  it('keeps a revision as it was made: the database refuses to change it', async () => {
    await expect(database.db('package_revisions').where({ id: draft.id }).update({ draft: false })).rejects.toThrow(/never changed/);
    expect((await database.db('package_revisions').where({ id: draft.id }).first('draft'))!.draft).toBe(true);
  });

  it('gives the same unchanged project the same fingerprint', { timeout: 90_000 }, async () => {
    const again = await makePackage();
    expect(again.status).toBe(201);
    expect(again.body.revision).toBe(2);
    expect(again.body.fingerprint).toBe(draft.fingerprint);
    expect(again.body.id).not.toBe(draft.id);
  });

  it('refuses the contractor drafts: not listed, not downloaded', async () => {
    expect((await contractor.agent.get(`/api/projects/${projectId}/packages`)).body.revisions).toEqual([]);
    const refused = await download(contractor, draft.files[0]!.url);
    expect(refused.status).toBe(403);
    expect((await makePackage(contractor)).status).toBe(403);
    expect((await makePackage(reviewer)).status).toBe(403);
    // A reviewer reads drafts.
    expect((await download(reviewer, draft.files[0]!.url)).status).toBe(200);
  });

  it(
    'issues an accepted design when its package is made: a final revision, the state Issued, both in the history',
    { timeout: 90_000 },
    async () => {
      await putInState('accepted');
      const response = await makePackage();
      expect(response.status, JSON.stringify(response.body)).toBe(201);
      final = response.body;
      expect(final).toMatchObject({ revision: 3, draft: false, fingerprint: draft.fingerprint });
      const project = await database.db('projects').where({ id: projectId }).first('state');
      expect(project!.state).toBe('issued');
      const history = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries as {
        action: string;
        entity: string;
        package?: { revision: number; draft: boolean };
        transition?: { to: string };
      }[];
      expect(history[0]).toMatchObject({ action: 'transition', transition: { to: 'issued' } });
      expect(history[1]).toMatchObject({ action: 'create', entity: 'package', package: { revision: 3, draft: false } });
      const pdf = await pdfPages((await download(engineer, final.files.find((file) => file.format === 'pdf')!.url)).body);
      expect(pdf.join('')).not.toContain('DRAFT');
    },
  );

  it('lets the contractor list and download the final package', async () => {
    const listed = (await contractor.agent.get(`/api/projects/${projectId}/packages`)).body.revisions;
    expect(listed.map((revision: { revision: number }) => revision.revision)).toEqual([3]);
    for (const file of final.files) expect((await download(contractor, file.url)).status).toBe(200);
  });

  it('answers a non-member 404, as for no such project, and a revision of another project 404', async () => {
    const other = await engineer.agent
      .post('/api/projects')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Harbour Ferry Terminal', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
    expect(other.status).toBe(201);
    const outside = await reviewer.agent.get(`/api/projects/${other.body.id}/packages`);
    expect(outside.status).toBe(404);
    const elsewhere = await engineer.agent.get(`/api/projects/${other.body.id}/packages/${final.id}/files/pdf`);
    expect(elsewhere.status).toBe(404);
    expect((await engineer.agent.get(`/api/projects/${projectId}/packages/${final.id}/files/exe`)).status).toBe(404);
    expect((await engineer.agent.get(`/api/projects/${projectId}/packages/not-an-id/files/pdf`)).status).toBe(404);
  });

  it('compares two revisions after one space changed', { timeout: 90_000 }, async () => {
    const reopened = await engineer.agent
      .post(`/api/projects/${projectId}/transitions`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ to: 'draft', version: (await database.db('projects').where({ id: projectId }).first('version'))!.version });
    expect(reopened.status, JSON.stringify(reopened.body)).toBe(200);
    const spaces = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body as {
      id: string;
      name: string;
      area: string;
      version: number;
    }[];
    const space = spaces[0]!;
    const area = String(Number(space.area) - 10);
    const patched = await engineer.agent
      .patch(`/api/projects/${projectId}/spaces/${space.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ version: space.version, area });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    const changed = await makePackage();
    expect(changed.status).toBe(201);
    expect(changed.body).toMatchObject({ revision: 4, draft: true });
    expect(changed.body.fingerprint).not.toBe(final.fingerprint);

    const comparison = await engineer.agent.get(`/api/projects/${projectId}/packages/compare?from=${final.id}&to=${changed.body.id}`);
    expect(comparison.status, JSON.stringify(comparison.body)).toBe(200);
    expect(comparison.body.from).toMatchObject({ revision: 3 });
    expect(comparison.body.to).toMatchObject({ revision: 4 });
    expect(comparison.body.spaces.added).toEqual([]);
    expect(comparison.body.spaces.removed).toEqual([]);
    expect(comparison.body.spaces.changed).toHaveLength(1);
    expect(comparison.body.spaces.changed[0]).toMatchObject({ id: space.id, name: space.name });
    const areaChange = comparison.body.spaces.changed[0].changes.find((change: { field: string }) => change.field === 'area');
    expect(areaChange, JSON.stringify(comparison.body.spaces.changed[0].changes)).toBeDefined();
    expect([Number(areaChange.from), Number(areaChange.to)]).toEqual([Number(space.area), Number(area)]);
    expect(comparison.body.totals).toContainEqual(expect.objectContaining({ field: 'interior.area' }));
    // The contractor compares final packages only.
    expect((await contractor.agent.get(`/api/projects/${projectId}/packages/compare?from=${final.id}&to=${changed.body.id}`)).status).toBe(
      404,
    );
  });

  it('tells anyone, without signing in, that a fingerprint was issued, for which project and revision, and when', async () => {
    const known = await request(app).get(`/verify/${final.fingerprint}`).set('Accept', 'application/json');
    expect(known.status).toBe(200);
    expect(known.body).toEqual({
      fingerprint: final.fingerprint,
      issued: true,
      packages: [{ projectName: demoName, revision: 3, issuedAt: expect.any(String) }],
    });
    const page = await request(app).get(`/verify/${final.fingerprint.toUpperCase()}`).set('Accept', 'text/html');
    expect(page.status).toBe(200);
    expect(page.text).toContain('This package was issued');
    expect(page.text).toContain('Alder Bay Library &amp; Makerspace, submittal revision 3');
    expect(page.text).not.toContain(projectId);
  });

  it('finds no issued package for an unknown fingerprint, a draft-only one, or text that is not a fingerprint', async () => {
    const unknown = await request(app)
      .get(`/verify/${'0'.repeat(64)}`)
      .set('Accept', 'application/json');
    expect(unknown.status).toBe(404);
    expect(unknown.body).toEqual({ fingerprint: '0'.repeat(64), issued: false, packages: [] });
    const draftOnly = (await database.db('package_revisions').where({ number: 4 }).first('fingerprint'))!.fingerprint;
    expect((await request(app).get(`/verify/${draftOnly}`).set('Accept', 'application/json')).body.issued).toBe(false);
    const page = await request(app).get('/verify/<script>').set('Accept', 'text/html');
    expect(page.status).toBe(404);
    expect(page.text).toContain('This is not a package fingerprint');
    expect(page.text).not.toContain('<script>');
  });

  it('records nothing when the file store is down, and says so', { timeout: 90_000 }, async () => {
    const before = await database.db('package_revisions').count<{ count: string }[]>('id as count');
    const down = testApp(database.db, database.url, { ...s3.settings, S3_ENDPOINT: `http://127.0.0.1:${await freePort()}` }).app;
    const signedIn = await signIn(down, 'engineer@alderbay.example');
    const response = await signedIn.agent.post(`/api/projects/${projectId}/packages`).set('X-CSRF-Token', signedIn.csrfToken);
    expect(response.status).toBe(503);
    expect(response.body.error.message).toMatch(/file store/);
    expect(await database.db('package_revisions').count<{ count: string }[]>('id as count')).toEqual(before);
  });
});
