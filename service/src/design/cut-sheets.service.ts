import { createHash, randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import type { Knex } from 'knex';
import { cutSheetNameMaxLength, type CutSheet } from '../../../contract/cut-sheets.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import { NotFound, Refused, Unavailable } from '../domain-errors.js';
import type { FileStorage } from '../package/storage.js';
import { deleteCutSheet, getCutSheet, putCutSheet, type CutSheetRead } from './cut-sheets.repository.js';

const storeDownWords = 'The cut sheet could not be stored: the file store did not answer. Nothing was changed; try again in a minute.';

/** Keys come from ids the service made, never from anything a person typed. */
function cutSheetKey(projectId: string): string {
  return `projects/${projectId}/cut-sheets/${randomUUID()}.pdf`;
}

export function cutSheetView(projectId: string, row: CutSheetRead): CutSheet {
  return {
    luminaireTypeId: row.luminaire_type_id,
    fileName: row.file_name,
    size: row.size,
    sha256: row.sha256,
    uploadedAt: row.uploaded_at.toISOString(),
    uploadedBy: row.uploaded_by_name,
    url: `/api/projects/${projectId}/luminaire-types/${row.luminaire_type_id}/cut-sheet`,
  };
}

/**
 * The name a cut sheet is kept and downloaded under: the last part of any path, control and
 * formatting characters dropped, spaces folded, at most 200 characters with its `.pdf` kept. It is
 * only ever shown (and sent in a Content-Disposition header through `attachment`), never a key.
 */
export function cutSheetFileName(given: string | undefined): string {
  const base = (given ?? '').normalize('NFC').split(/[/\\]/).pop() ?? '';
  const cleaned = Array.from(base)
    .filter((character) => !/[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]/u.test(character))
    .join('')
    .replace(/\s+/g, ' ')
    .trim();
  const stem = cleaned.replace(/\.pdf$/i, '').replace(/^\.+/, '');
  if (stem === '') return 'Cut sheet.pdf';
  const room = cutSheetNameMaxLength - '.pdf'.length;
  return `${Array.from(stem).slice(0, room).join('').trim()}.pdf`;
}

/** The type must be the project's, and the design open to change; the lock orders this against other design writes. */
async function lockedType(trx: Knex.Transaction, projectId: string, typeId: string): Promise<{ tag: string }> {
  await lockProject(trx, projectId);
  const type = await trx('luminaire_types').where({ id: typeId, project_id: projectId }).first<{ tag: string } | undefined>('tag');
  if (!type) throw new NotFound('This luminaire type does not exist.');
  return type;
}

/**
 * Attaches a cut sheet to a luminaire type, replacing the one it had. The content must be a PDF
 * (read from its bytes, whatever it is called or declared as). The file is stored first, then
 * recorded with its audit entry in one transaction; a failed record removes the stored file, and
 * the replaced file goes once the new record is committed. A store that does not answer records nothing.
 */
export async function attachCutSheet(
  db: Database,
  storage: FileStorage,
  projectId: string,
  typeId: string,
  body: Buffer,
  givenName: string | undefined,
  userId: string,
): Promise<CutSheet> {
  const kind = body.length === 0 ? undefined : await fileTypeFromBuffer(body);
  if (kind?.mime !== 'application/pdf') {
    throw new Refused('The cut sheet must be a PDF file. This file is not one, whatever its name says.', [
      { path: 'file', message: kind ? `This file is ${kind.ext.toUpperCase()}, not PDF.` : 'This file is not a PDF.' },
    ]);
  }
  // Before anything is stored: a type that is not there, or a design that may not change, stores nothing.
  await db.transaction((trx) => lockedType(trx, projectId, typeId));

  const key = cutSheetKey(projectId);
  const fileName = cutSheetFileName(givenName);
  const sha256 = createHash('sha256').update(body).digest('hex');
  try {
    await storage.put(key, body, 'application/pdf');
  } catch (error) {
    throw error instanceof Unavailable ? new Unavailable(storeDownWords, error) : error;
  }
  let replaced: CutSheetRead | undefined;
  try {
    await db.transaction(async (trx) => {
      const type = await lockedType(trx, projectId, typeId);
      replaced = await getCutSheet(trx, projectId, typeId);
      await putCutSheet(trx, {
        luminaire_type_id: typeId,
        project_id: projectId,
        storage_key: key,
        size: body.length,
        sha256,
        file_name: fileName,
        uploaded_by: userId,
      });
      await recordAudit(trx, {
        userId,
        projectId,
        action: 'attach-cut-sheet',
        entity: 'luminaire-type',
        entityId: typeId,
        detail: {
          name: type.tag,
          cutSheet: { fileName, size: body.length, sha256 },
          ...(replaced ? { replaced: { fileName: replaced.file_name, size: replaced.size, sha256: replaced.sha256 } } : {}),
        },
      });
    });
  } catch (error) {
    // No row names the new file: it goes, as far as the store lets it.
    await storage.remove(key).catch(() => undefined);
    throw error;
  }
  if (replaced) await storage.remove(replaced.storage_key).catch(() => undefined);
  const recorded = await getCutSheet(db, projectId, typeId);
  return cutSheetView(projectId, recorded!);
}

/** Removes a type's cut sheet: the record first (audited), then the file, which no row names any longer. */
export async function removeCutSheet(db: Database, storage: FileStorage, projectId: string, typeId: string, userId: string): Promise<void> {
  const removed = await db.transaction(async (trx) => {
    const type = await lockedType(trx, projectId, typeId);
    const current = await getCutSheet(trx, projectId, typeId);
    if (!current) throw new NotFound('This luminaire type has no cut sheet on file.');
    await deleteCutSheet(trx, projectId, typeId);
    await recordAudit(trx, {
      userId,
      projectId,
      action: 'remove-cut-sheet',
      entity: 'luminaire-type',
      entityId: typeId,
      detail: { name: type.tag, cutSheet: { fileName: current.file_name, size: current.size, sha256: current.sha256 } },
    });
    return current;
  });
  await storage.remove(removed.storage_key).catch(() => undefined);
}
