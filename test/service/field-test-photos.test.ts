import type { Express } from 'express';
import JSZip from 'jszip';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../service/ops/postgres.mjs';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { startTestS3, type TestS3 } from '../support/s3.js';

/*
 * Photos of the demo project's test plan items: added by the contractor, read by members, their
 * copies shrunk and without metadata (sharp's documented default: output has no EXIF unless
 * `withMetadata`/`keepMetadata` is asked for — sharp docs, "Output options").
 */

let database: TestDatabase;
let s3: TestS3;
let app: Express;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let contractor: SignedInAgent;
let projectId: string;
let itemIds: string[];

interface Photo {
  id: string;
  caption: string | null;
  width: number;
  height: number;
  by: { name: string } | null;
  resultId: string | null;
}

/** A camera-sized JPEG with EXIF (orientation 6: the camera was turned a quarter, so it reads upright as portrait) and a GPS-like comment. */
async function cameraJpeg(width = 3000, height = 2000): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 200, g: 160, b: 40 } } })
    .jpeg({ quality: 70 })
    .withMetadata({ orientation: 6 })
    .withExifMerge({ IFD0: { Make: 'TestCam', ImageDescription: 'GPS 49.2827 N 123.1207 W' } })
    .toBuffer();
}

function upload(who: SignedInAgent, itemId: string, body: Buffer, type = 'image/jpeg', caption?: string) {
  const url = `/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemId)}/photos${caption ? `?caption=${encodeURIComponent(caption)}` : ''}`;
  return who.agent.post(url).set('X-CSRF-Token', who.csrfToken).set('Content-Type', type).send(body);
}

function photoUrl(itemId: string, photoId: string, size: string) {
  return `/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemId)}/photos/${photoId}?size=${size}`;
}

async function photoCount(): Promise<number> {
  const [row] = await database.db('field_test_photos').count<{ count: string }[]>('id as count');
  return Number(row?.count ?? 0);
}

beforeAll(async () => {
  database = await freshDatabase();
  s3 = await startTestS3();
  ({ app } = testApp(database.db, database.url, s3.settings));
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === 'Alder Bay Library & Makerspace').id;
  const plan = await contractor.agent.get(`/api/projects/${projectId}/test-plan`);
  itemIds = plan.body.items.filter((item: { required: boolean }) => item.required).map((item: { id: string }) => item.id);
  expect(itemIds.length).toBeGreaterThan(2);
}, 120_000);

afterAll(async () => {
  await s3?.stop();
  await database?.drop();
});

describe('field test photos', () => {
  it('adds a photo to an item, linked to its latest test, listed on the plan and audited', { timeout: 60_000 }, async () => {
    const itemId = itemIds[0]!;
    const tested = await contractor.agent
      .patch(`/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemId)}`)
      .set('X-CSRF-Token', contractor.csrfToken)
      .send({ result: 'pass', measured: { timeoutMinutes: 20 } });
    expect(tested.status).toBe(200);
    const original = await cameraJpeg();
    const response = await upload(contractor, itemId, original, 'image/jpeg', 'Sensor above the door');
    expect(response.status).toBe(201);
    const added = response.body as Photo;
    expect(added.caption).toBe('Sensor above the door');
    expect(added.resultId).toBe(tested.body.item.result.id);
    // Turned upright by EXIF orientation 6 first, then shrunk to 1,600 px on its longest side.
    expect([added.width, added.height]).toEqual([1067, 1600]);
    const plan = await reviewer.agent.get(`/api/projects/${projectId}/test-plan`);
    const item = plan.body.items.find((entry: { id: string }) => entry.id === itemId);
    expect(item.photos.map((photo: Photo) => photo.id)).toEqual([added.id]);
    expect(item.photos[0].by.name).not.toBe('');
    const row = await database.db('field_test_photos').where({ id: added.id }).first();
    expect(row?.size_bytes).toBe(original.length);
    expect(row?.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(row?.original_key).not.toContain('Sensor');
    const audit = await database.db('audit_log').where({ project_id: projectId, action: 'add-photo' });
    expect(audit).toHaveLength(1);
  });

  it('serves a thumbnail smaller than the display copy, both without metadata, to members', { timeout: 60_000 }, async () => {
    const itemId = itemIds[1]!;
    const added = (await upload(contractor, itemId, await cameraJpeg())).body as Photo;
    const read = async (size: string) => {
      const response = await reviewer.agent.get(photoUrl(itemId, added.id, size)).responseType('blob');
      expect(response.status).toBe(200);
      return { type: response.headers['content-type'], data: response.body as Buffer };
    };
    const thumb = await read('thumb');
    const display = await read('display');
    const original = await read('original');
    expect(thumb.type).toBe('image/jpeg');
    expect(thumb.data.length).toBeLessThan(display.data.length);
    const thumbMeta = await sharp(thumb.data).metadata();
    expect(thumbMeta.format).toBe('jpeg');
    expect(Math.max(thumbMeta.width, thumbMeta.height)).toBe(320);
    for (const copy of [thumb, display]) {
      const meta = await sharp(copy.data).metadata();
      expect(meta.exif).toBeUndefined();
      expect(copy.data.includes(Buffer.from('GPS 49.2827'))).toBe(false);
    }
    expect(original.data.includes(Buffer.from('TestCam'))).toBe(true);
    const png = await upload(
      contractor,
      itemId,
      await sharp({ create: { width: 800, height: 600, channels: 4, background: '#3366cc' } })
        .png()
        .toBuffer(),
      'image/png',
    );
    expect(png.status).toBe(201);
    const pngThumb = await reviewer.agent.get(photoUrl(itemId, png.body.id, 'thumb')).responseType('blob');
    expect(pngThumb.headers['content-type']).toBe('image/png');
    expect((await sharp(pngThumb.body as Buffer).metadata()).format).toBe('png');
  });

  it('refuses a file that is not the image it says it is, in words', async () => {
    const before = await photoCount();
    const spoofed = Buffer.concat([Buffer.from('<html><script>alert(1)</script>'), Buffer.alloc(2000, 32)]);
    const response = await upload(contractor, itemIds[2]!, spoofed, 'image/jpeg');
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/not a JPEG or PNG photo/);
    const pdfAsPng = await upload(contractor, itemIds[2]!, Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n'), 'image/png');
    expect(pdfAsPng.status).toBe(400);
    const text = await upload(contractor, itemIds[2]!, Buffer.from('hello'), 'text/plain');
    expect(text.status).toBe(400);
    expect(await photoCount()).toBe(before);
  });

  it('refuses a photo over 10 MB with 413 in words', { timeout: 60_000 }, async () => {
    const before = await photoCount();
    const big = Buffer.concat([await cameraJpeg(400, 300), Buffer.alloc(10 * 1024 * 1024, 0)]);
    const response = await upload(contractor, itemIds[2]!, big);
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/larger than 10 MB/);
    expect(await photoCount()).toBe(before);
  });

  it('keeps at most 20 photos on one item', { timeout: 120_000 }, async () => {
    const itemId = itemIds[2]!;
    const small = await cameraJpeg(64, 48);
    for (let count = 0; count < 20; count += 1) expect((await upload(contractor, itemId, small)).status).toBe(201);
    const refused = await upload(contractor, itemId, small);
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toMatch(/already has 20 photos/);
    expect(await database.db('field_test_photos').where({ item_id: itemId }).count<{ count: string }[]>('id as count')).toEqual([
      { count: '20' },
    ]);
  });

  it('lets only the contractor add and remove; others are refused, a photo of another item is not found', async () => {
    const small = await cameraJpeg(64, 48);
    expect((await upload(reviewer, itemIds[0]!, small)).status).toBe(403);
    expect((await upload(engineer, itemIds[0]!, small)).status).toBe(403);
    const added = (await upload(contractor, itemIds[0]!, small)).body as Photo;
    expect((await reviewer.agent.get(photoUrl(itemIds[1]!, added.id, 'thumb'))).status).toBe(404);
    const wrongSize = await reviewer.agent.get(photoUrl(itemIds[0]!, added.id, 'huge'));
    expect(wrongSize.status).toBe(400);
    const url = `/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemIds[0]!)}/photos/${added.id}`;
    expect((await reviewer.agent.delete(url).set('X-CSRF-Token', reviewer.csrfToken)).status).toBe(403);
    expect((await contractor.agent.delete(url).set('X-CSRF-Token', contractor.csrfToken)).status).toBe(204);
    expect((await reviewer.agent.get(`${url}?size=thumb`)).status).toBe(404);
    expect(await database.db('audit_log').where({ project_id: projectId, action: 'remove-photo' })).toHaveLength(1);
  });

  it('is closed to a non-member', async () => {
    const other = await engineer.agent
      .post('/api/projects')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Harbour Ferry Terminal', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
    expect(other.status).toBe(201);
    const photo = await database.db('field_test_photos').first('id', 'item_id');
    const outside = await contractor.agent.get(
      `/api/projects/${other.body.id}/test-plan/items/${encodeURIComponent(photo!.item_id)}/photos/${photo!.id}?size=thumb`,
    );
    // A project's routes answer a signed-in non-member 404, as for no such project (projects.test.ts), before any photo is looked up.
    expect(outside.status).toBe(404);
  });

  it('records nothing when the file store is down, and says so', { timeout: 90_000 }, async () => {
    const before = await photoCount();
    const auditBefore = await database.db('audit_log').where({ action: 'add-photo' }).count<{ count: string }[]>('id as count');
    const down = testApp(database.db, database.url, { ...s3.settings, S3_ENDPOINT: `http://127.0.0.1:${await freePort()}` }).app;
    const signedIn = await signIn(down, 'contractor@alderbay.example');
    const response = await upload(signedIn, itemIds[1]!, await cameraJpeg(64, 48));
    expect(response.status).toBe(503);
    expect(response.body.error.message).toMatch(/file store/);
    expect(await photoCount()).toBe(before);
    expect(await database.db('audit_log').where({ action: 'add-photo' }).count<{ count: string }[]>('id as count')).toEqual(auditBefore);
  });
});

describe('the field test record', () => {
  it(
    'is a Word document with every item’s title and result, a photo as media, the cautions and signature lines',
    { timeout: 90_000 },
    async () => {
      const response = await reviewer.agent.get(`/api/projects/${projectId}/test-plan/record`).responseType('blob');
      expect(response.status).toBe(200);
      expect(response.headers['content-disposition']).toContain('Alder Bay Library');
      expect(response.headers['content-disposition']).toContain('field test record.docx');
      const zip = await JSZip.loadAsync(response.body as Buffer);
      const xml = await zip.file('word/document.xml')!.async('string');
      const text = xml
        .replace(/<[^>]+>/g, ' ')
        .replace(/&amp;/g, '&')
        .replace(/&apos;|&#39;/g, "'")
        .replace(/\s+/g, ' ');
      const plan = await reviewer.agent.get(`/api/projects/${projectId}/test-plan`);
      for (const item of plan.body.items as { title: string; result?: { result: string } }[]) {
        expect(text).toContain(item.title.replace(/\s+/g, ' '));
      }
      expect(text).toContain('Result: Passed');
      expect(text).toContain('Result: Not tested yet');
      expect(text).toContain('Sensor above the door');
      expect(text).toContain('Commissioning agent');
      expect(text).toContain('Owner’s representative');
      expect(text).toContain('Cautions');
      const media = Object.keys(zip.files).filter((name) => name.startsWith('word/media/'));
      expect(media.length).toBeGreaterThan(0);
    },
  );
});
