import { createHash, randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Sharp } from 'sharp';
import { photosPerItem, type FieldTestPhoto } from '../../../contract/field-tests.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import type { FieldTestPhotoRow, ProjectRole } from '../db/tables.js';
import { NotFound, Refused } from '../domain-errors.js';
import type { FileStorage } from '../package/storage.js';

/** The display copy's longest side, and the thumbnail's, in pixels. */
const displaySide = 1600;
const thumbSide = 320;
/** Images larger than this many pixels are refused before decoding (a 50-megapixel camera is the top of common practice). */
const maxInputPixels = 50_000_000;

export type PhotoSize = 'thumb' | 'display' | 'original';

interface PhotoRead extends FieldTestPhotoRow {
  user_name: string | null;
}

function photo(row: PhotoRead): FieldTestPhoto {
  return {
    id: row.id,
    caption: row.caption,
    at: row.added_at.toISOString(),
    by: row.added_by ? { id: row.added_by, name: row.user_name ?? '' } : null,
    width: row.width,
    height: row.height,
    resultId: row.result_id === null ? null : String(row.result_id),
  };
}

function photoRows(db: Database, projectId: string) {
  return db('field_test_photos as p')
    .leftJoin('users as u', 'u.id', 'p.added_by')
    .where('p.project_id', projectId)
    .select<PhotoRead[]>('p.*', 'u.name as user_name');
}

/** Every photo of a project by plan item, oldest first. */
export async function listPhotos(db: Database, projectId: string): Promise<Map<string, FieldTestPhoto[]>> {
  const rows = await photoRows(db, projectId).orderBy([{ column: 'p.added_at' }, { column: 'p.id' }]);
  const byItem = new Map<string, FieldTestPhoto[]>();
  for (const row of rows) byItem.set(row.item_id, [...(byItem.get(row.item_id) ?? []), photo(row)]);
  return byItem;
}

interface Prepared {
  contentType: 'image/jpeg' | 'image/png';
  display: { data: Buffer; width: number; height: number };
  thumb: Buffer;
}

/**
 * Checks what a photo is by its content (not by what the sender said) and makes its two copies:
 * turned upright by its EXIF orientation first, then shrunk; sharp writes no metadata unless asked,
 * so the copies carry no GPS position, camera or time. Only the original keeps them.
 */
export async function preparePhoto(body: Buffer): Promise<Prepared> {
  const type = await fileTypeFromBuffer(body);
  if (type?.mime !== 'image/jpeg' && type?.mime !== 'image/png')
    throw new Refused('This file is not a JPEG or PNG photo. Take the photo again or choose a JPEG or PNG file.');
  const contentType = type.mime;
  try {
    const image = () => sharp(body, { limitInputPixels: maxInputPixels, failOn: 'error' }).rotate();
    const format = (pipeline: Sharp) => (contentType === 'image/png' ? pipeline.png() : pipeline.jpeg({ quality: 82 }));
    const display = await format(
      image().resize({ width: displaySide, height: displaySide, fit: 'inside', withoutEnlargement: true }),
    ).toBuffer({ resolveWithObject: true });
    const thumb = await format(image().resize({ width: thumbSide, height: thumbSide, fit: 'inside', withoutEnlargement: true })).toBuffer();
    return { contentType, display: { data: display.data, width: display.info.width, height: display.info.height }, thumb };
  } catch {
    throw new Refused('This photo could not be read: it may be damaged, or larger than 50 megapixels.');
  }
}

/**
 * Adds a photo to a plan item: the three files go to the file store first, then the row and its
 * audit entry in one transaction under the project's lock (the count per item checked there). If
 * the store is down nothing is recorded; if the record fails the stored files are removed.
 */
export async function addPhoto(
  db: Database,
  storage: FileStorage,
  projectId: string,
  item: { id: string; title: string; latestResultId: string | null },
  input: { body: Buffer; caption?: string },
  actor: { userId: string; role: ProjectRole | null },
): Promise<FieldTestPhoto> {
  const existing = await db('field_test_photos')
    .where({ project_id: projectId, item_id: item.id })
    .count<{ count: string }[]>('id as count');
  if (Number(existing[0]?.count ?? 0) >= photosPerItem) throw tooMany();
  const prepared = await preparePhoto(input.body);
  const id = randomUUID();
  const base = `field-test-photos/${projectId}/${id}`;
  const extension = prepared.contentType === 'image/png' ? 'png' : 'jpg';
  const keys = { original: `${base}/original.${extension}`, display: `${base}/display.${extension}`, thumb: `${base}/thumb.${extension}` };
  const removeAll = () => Promise.allSettled(Object.values(keys).map((key) => storage.remove(key)));
  try {
    await storage.put(keys.original, input.body, prepared.contentType);
    await storage.put(keys.display, prepared.display.data, prepared.contentType);
    await storage.put(keys.thumb, prepared.thumb, prepared.contentType);
  } catch (error) {
    await removeAll();
    throw error;
  }
  try {
    return await db.transaction(async (trx) => {
      await lockProject(trx, projectId, { anyState: true });
      const count = await trx('field_test_photos')
        .where({ project_id: projectId, item_id: item.id })
        .count<{ count: string }[]>('id as count');
      if (Number(count[0]?.count ?? 0) >= photosPerItem) throw tooMany();
      await trx('field_test_photos').insert({
        id,
        project_id: projectId,
        item_id: item.id,
        result_id: item.latestResultId,
        caption: input.caption ?? null,
        content_type: prepared.contentType,
        size_bytes: input.body.length,
        sha256: createHash('sha256').update(input.body).digest('hex'),
        width: prepared.display.width,
        height: prepared.display.height,
        original_key: keys.original,
        display_key: keys.display,
        thumb_key: keys.thumb,
        added_by: actor.userId,
      });
      await recordAudit(trx, {
        userId: actor.userId,
        projectId,
        action: 'add-photo',
        entity: 'field-test',
        entityId: null,
        detail: { name: item.title, photo: { id, caption: input.caption ?? null, bytes: input.body.length, role: actor.role } },
      });
      const row = await photoRows(trx, projectId).where('p.id', id).first();
      return photo(row as PhotoRead);
    });
  } catch (error) {
    await removeAll();
    throw error;
  }
}

function tooMany(): Refused {
  return new Refused(`This test item already has ${photosPerItem} photos, the most it keeps. Remove one before adding another.`);
}

/** One of a photo's files and its type; 404 for a photo not on this project. */
export async function readPhoto(
  db: Database,
  storage: FileStorage,
  projectId: string,
  photo: { itemId: string; photoId: string },
  size: PhotoSize,
): Promise<{ data: Buffer; contentType: string }> {
  const row = await db('field_test_photos').where({ project_id: projectId, item_id: photo.itemId, id: photo.photoId }).first();
  if (!row) throw new NotFound('That photo does not exist.');
  const key = size === 'original' ? row.original_key : size === 'display' ? row.display_key : row.thumb_key;
  return { data: await storage.get(key), contentType: row.content_type };
}

/** The display copies of a project's photos, newest first, at most `limit`; with how many there are in all. */
export async function displayCopies(
  db: Database,
  storage: FileStorage,
  projectId: string,
  limit: number,
): Promise<{ total: number; photos: (FieldTestPhoto & { itemId: string; data: Buffer; type: 'jpg' | 'png' })[] }> {
  const rows = await photoRows(db, projectId).orderBy([
    { column: 'p.added_at', order: 'desc' },
    { column: 'p.id', order: 'desc' },
  ]);
  const chosen = rows.slice(0, limit);
  const photos = [];
  for (const row of chosen) {
    photos.push({
      ...photo(row),
      itemId: row.item_id,
      data: await storage.get(row.display_key),
      type: row.content_type === 'image/png' ? ('png' as const) : ('jpg' as const),
    });
  }
  return { total: rows.length, photos };
}

/** Removes a photo: the row and its audit entry, then its files (a file left behind names nothing). */
export async function removePhoto(
  db: Database,
  storage: FileStorage,
  projectId: string,
  item: { id: string; title: string },
  photoId: string,
  actor: { userId: string; role: ProjectRole | null },
): Promise<void> {
  const row = await db.transaction(async (trx) => {
    await lockProject(trx, projectId, { anyState: true });
    const found = await trx('field_test_photos').where({ project_id: projectId, item_id: item.id, id: photoId }).first();
    if (!found) throw new NotFound('That photo does not exist.');
    await trx('field_test_photos').where({ id: photoId }).delete();
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: 'remove-photo',
      entity: 'field-test',
      entityId: null,
      detail: { name: item.title, photo: { id: photoId, caption: found.caption, role: actor.role } },
    });
    return found;
  });
  await Promise.allSettled([row.original_key, row.display_key, row.thumb_key].map((key) => storage.remove(key)));
}
