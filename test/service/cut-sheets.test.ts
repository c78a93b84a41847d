import { createHash } from 'node:crypto';
import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3';
import ExcelJS from 'exceljs';
import type { Express } from 'express';
import JSZip from 'jszip';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../service/ops/postgres.mjs';
import { localS3Credentials } from '../../service/ops/s3-server.mjs';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { startTestS3, type TestS3 } from '../support/s3.js';

let database: TestDatabase;
let s3: TestS3;
let app: Express;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let projectId: string;
let type: { id: string; tag: string };

const demoName = 'Alder Bay Library & Makerspace';

/**
 * A small PDF of our own: the `%PDF-` header and `%%EOF` trailer of ISO 32000-1 §7.5.2 and §7.5.5,
 * which is what file-type reads to call it PDF (file-type's README: detection by magic number).
 */
const pdf = Buffer.from(
  '%PDF-1.7\n1 0 obj\n<< /Type /Catalog /Pages 2 0 R >>\nendobj\n2 0 obj\n<< /Type /Pages /Kids [] /Count 0 >>\nendobj\n' +
    'trailer\n<< /Root 1 0 R >>\n%%EOF\n',
);

beforeAll(async () => {
  database = await freshDatabase();
  s3 = await startTestS3();
  ({ app } = testApp(database.db, database.url, s3.settings));
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === demoName).id;
  const types = (await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body as { id: string; tag: string }[];
  type = types[0]!;
});

afterAll(async () => {
  await s3?.stop();
  await database?.drop();
});

function upload(who: SignedInAgent, body: Buffer, name: string, typeId = type.id, project = projectId) {
  return who.agent
    .put(`/api/projects/${project}/luminaire-types/${typeId}/cut-sheet`)
    .query({ name })
    .set('X-CSRF-Token', who.csrfToken)
    .set('Content-Type', 'application/pdf')
    .send(body);
}

/** Whether the store holds a key, asked of the test's S3 server directly. */
async function inStore(key: string): Promise<boolean> {
  const client = new S3Client({ endpoint: s3.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: localS3Credentials });
  try {
    await client.send(new HeadObjectCommand({ Bucket: s3.bucket, Key: key }));
    return true;
  } catch {
    return false;
  }
}

function download(who: SignedInAgent, typeId = type.id, project = projectId) {
  return who.agent.get(`/api/projects/${project}/luminaire-types/${typeId}/cut-sheet`).responseType('blob');
}

async function rowsOf(typeId = type.id) {
  return database.db('luminaire_cut_sheets').where({ luminaire_type_id: typeId });
}

async function cutSheetAudits() {
  return database.db('audit_log').whereIn('action', ['attach-cut-sheet', 'remove-cut-sheet']).orderBy('id');
}

describe('PUT /api/projects/:id/luminaire-types/:typeId/cut-sheet', () => {
  it('stores a PDF and gives it back byte for byte, under its cleaned name', async () => {
    const response = await upload(engineer, pdf, 'C:\\fakepath\\Downlight\u0007 cut sheet.pdf');
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body).toMatchObject({
      luminaireTypeId: type.id,
      fileName: 'Downlight cut sheet.pdf',
      size: pdf.length,
      sha256: createHash('sha256').update(pdf).digest('hex'),
      uploadedBy: engineer.user.name,
    });
    const [row] = await rowsOf();
    // The key is the service's own: the project's id and a random one, nothing typed.
    expect(row!.storage_key).toMatch(new RegExp(`^projects/${projectId}/cut-sheets/[0-9a-f-]{36}\\.pdf$`));

    const back = await download(reviewer);
    expect(back.status).toBe(200);
    expect((back.body as Buffer).equals(pdf)).toBe(true);
    expect(back.headers['content-type']).toBe('application/pdf');
    // RFC 6266 with RFC 8187's filename* (content-disposition.ts).
    expect(back.headers['content-disposition']).toBe(
      `attachment; filename="Downlight cut sheet.pdf"; filename*=UTF-8''Downlight%20cut%20sheet.pdf`,
    );
    const listed = (await reviewer.agent.get(`/api/projects/${projectId}/cut-sheets`)).body;
    expect(listed).toEqual([response.body]);

    const [audit] = await cutSheetAudits();
    expect(audit).toMatchObject({ action: 'attach-cut-sheet', entity: 'luminaire-type', entity_id: type.id, user_id: engineer.user.id });
    expect(audit!.detail).toMatchObject({ name: type.tag, cutSheet: { fileName: 'Downlight cut sheet.pdf', size: pdf.length } });
  });

  it('replaces the cut sheet, and the replaced file leaves the store', async () => {
    const [before] = await rowsOf();
    const second = Buffer.concat([pdf, Buffer.from('% second edition\n')]);
    const response = await upload(engineer, second, 'Downlight rev B.pdf');
    expect(response.status).toBe(200);
    const rows = await rowsOf();
    expect(rows).toHaveLength(1);
    expect(rows[0]!.storage_key).not.toBe(before!.storage_key);
    expect(((await download(engineer)).body as Buffer).equals(second)).toBe(true);
    expect(await inStore(before!.storage_key)).toBe(false);
    expect(await inStore(rows[0]!.storage_key)).toBe(true);
    const audits = await cutSheetAudits();
    expect(audits.at(-1)!.detail).toMatchObject({ replaced: { fileName: 'Downlight cut sheet.pdf' } });
  });

  it('refuses a PNG or a text file named .pdf and sent as application/pdf, in words', async () => {
    const png = await sharp({ create: { width: 4, height: 4, channels: 3, background: '#ffffff' } })
      .png()
      .toBuffer();
    const before = await rowsOf();
    for (const [body, words] of [
      [png, /PNG, not PDF/],
      [Buffer.from('This is only text, though its name says PDF.\n'), /not a PDF/],
      [Buffer.alloc(0), /not a PDF/],
    ] as const) {
      const response = await upload(engineer, body, 'Spoofed.pdf');
      expect(response.status).toBe(400);
      expect(response.body.error.message).toBe('The cut sheet must be a PDF file. This file is not one, whatever its name says.');
      expect(response.body.error.details[0].message).toMatch(words);
    }
    expect(await rowsOf()).toEqual(before);
  });

  it('refuses a file over 20 MB with 413 in words, before reading it', async () => {
    const big = Buffer.concat([pdf, Buffer.alloc(20 * 1024 * 1024 + 1 - pdf.length, 0x20)]);
    const response = await upload(engineer, big, 'Huge.pdf');
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/larger than 20 MB/);
    // Exactly 20 MB is taken.
    const limit = Buffer.concat([pdf, Buffer.alloc(20 * 1024 * 1024 - pdf.length, 0x20)]);
    const types = (await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body as { id: string }[];
    const taken = await upload(engineer, limit, 'Exactly twenty.pdf', types[1]!.id);
    expect(taken.status, JSON.stringify(taken.body)).toBe(200);
    expect(taken.body.size).toBe(20 * 1024 * 1024);
    expect(
      (
        await engineer.agent
          .delete(`/api/projects/${projectId}/luminaire-types/${types[1]!.id}/cut-sheet`)
          .set('X-CSRF-Token', engineer.csrfToken)
      ).status,
    ).toBe(204);
  });

  it('lets a reviewer read it but not attach or remove one', async () => {
    const response = await upload(reviewer, pdf, 'Reviewer.pdf');
    expect(response.status).toBe(403);
    const removed = await reviewer.agent
      .delete(`/api/projects/${projectId}/luminaire-types/${type.id}/cut-sheet`)
      .set('X-CSRF-Token', reviewer.csrfToken);
    expect(removed.status).toBe(403);
    expect(await rowsOf()).toHaveLength(1);
  });

  it('answers 404 to anyone not on the project, as if it did not exist', async () => {
    const own = await engineer.agent
      .post('/api/projects')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Cut sheet privacy check', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
    expect(own.status, JSON.stringify(own.body)).toBe(201);
    const made = await engineer.agent
      .post(`/api/projects/${own.body.id}/luminaire-types`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ tag: 'Z1', description: 'Invented strip', inputWatts: '20', use: 'general', basis: 'rated' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect((await upload(engineer, pdf, 'Private.pdf', made.body.id, own.body.id)).status).toBe(200);
    // The reviewer of the demo project is on no team of this one.
    for (const response of [
      await download(reviewer, made.body.id, own.body.id),
      await reviewer.agent.get(`/api/projects/${own.body.id}/cut-sheets`),
      await upload(reviewer, pdf, 'Intruder.pdf', made.body.id, own.body.id),
    ]) {
      expect(response.status).toBe(404);
      expect(JSON.stringify(response.body)).not.toContain('Private.pdf');
    }
  });

  it('refuses a change while the design is in review, like every design write', async () => {
    await database.db('projects').where({ id: projectId }).update({ state: 'in-review' });
    try {
      const response = await upload(engineer, pdf, 'Late.pdf');
      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('locked');
      expect(((await download(engineer)).body as Buffer).equals(pdf)).toBe(false);
    } finally {
      await database.db('projects').where({ id: projectId }).update({ state: 'draft' });
    }
  });

  it('records nothing when the file store is down, and says so', async () => {
    const types = (await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body as { id: string }[];
    const down = testApp(database.db, database.url, { ...s3.settings, S3_ENDPOINT: `http://127.0.0.1:${await freePort()}` }).app;
    const signedIn = await signIn(down, 'engineer@alderbay.example');
    const audits = (await cutSheetAudits()).length;
    const response = await signedIn.agent
      .put(`/api/projects/${projectId}/luminaire-types/${types[2]!.id}/cut-sheet`)
      .query({ name: 'Unstored.pdf' })
      .set('X-CSRF-Token', signedIn.csrfToken)
      .set('Content-Type', 'application/pdf')
      .send(pdf);
    expect(response.status).toBe(503);
    expect(response.body.error.message).toMatch(/file store did not answer/);
    expect(await rowsOf(types[2]!.id)).toEqual([]);
    expect(await cutSheetAudits()).toHaveLength(audits);
  });
});

describe('the submittal package lists the cut sheets', () => {
  it('names the file in the Word schedule and the workbook, and says where none is on file', { timeout: 120_000 }, async () => {
    const made = await engineer.agent.post(`/api/projects/${projectId}/packages`).set('X-CSRF-Token', engineer.csrfToken);
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const url = (format: string) => made.body.files.find((file: { format: string }) => file.format === format).url;

    const docx = (await engineer.agent.get(url('docx')).responseType('blob')).body as Buffer;
    const xml = await (await JSZip.loadAsync(docx)).file('word/document.xml')!.async('string');
    const text = xml.replace(/<\/w:p>/g, '\n').replace(/<[^>]+>/g, '');
    expect(text).toContain('Downlight rev B.pdf');
    expect(text).toContain('None on file');

    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await engineer.agent.get(url('xlsx')).responseType('blob')).body as ArrayBuffer);
    const sheet = workbook.getWorksheet('Luminaires')!;
    const header = sheet.getRow(1).values as unknown[];
    const column = header.indexOf('Cut sheet');
    expect(column).toBeGreaterThan(0);
    const byTag = new Map<string, unknown>();
    sheet.eachRow((row, number) => {
      if (number > 1) byTag.set(String(row.getCell(1).value), row.getCell(column).value);
    });
    expect(byTag.get(type.tag)).toBe('Downlight rev B.pdf');
    expect([...byTag.values()]).toContain('None on file');
  });
});

describe('DELETE /api/projects/:id/luminaire-types/:typeId/cut-sheet', () => {
  it('removes the record and the file, audited', async () => {
    const [row] = await rowsOf();
    const response = await engineer.agent
      .delete(`/api/projects/${projectId}/luminaire-types/${type.id}/cut-sheet`)
      .set('X-CSRF-Token', engineer.csrfToken);
    expect(response.status).toBe(204);
    expect(await rowsOf()).toEqual([]);
    expect((await download(engineer)).status).toBe(404);
    expect((await cutSheetAudits()).at(-1)).toMatchObject({ action: 'remove-cut-sheet', entity_id: type.id });
    expect(await inStore(row!.storage_key)).toBe(false);
  });

  it('takes the file out of the store when its luminaire type is deleted', async () => {
    const created = await engineer.agent
      .post(`/api/projects/${projectId}/luminaire-types`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ tag: 'Z9', inputWatts: '20', use: 'general' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect((await upload(engineer, pdf, 'Spare type.pdf', created.body.id)).status).toBe(200);
    const [row] = await rowsOf(created.body.id);
    expect(await inStore(row!.storage_key)).toBe(true);
    const deleted = await engineer.agent
      .delete(`/api/projects/${projectId}/luminaire-types/${created.body.id}`)
      .query({ version: created.body.version })
      .set('X-CSRF-Token', engineer.csrfToken);
    expect(deleted.status, JSON.stringify(deleted.body)).toBe(204);
    expect(await rowsOf(created.body.id)).toEqual([]);
    expect(await inStore(row!.storage_key)).toBe(false);
  });
});
