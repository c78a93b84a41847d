import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { LuminaireCutSheetRow } from '../db/tables.js';

export type CutSheetRead = LuminaireCutSheetRow & { uploaded_by_name: string | null };

function withUploader(db: Knex) {
  return db('luminaire_cut_sheets as c')
    .leftJoin('users as u', 'u.id', 'c.uploaded_by')
    .select<CutSheetRead[]>('c.*', 'u.name as uploaded_by_name');
}

/** The project's cut sheets on file, of types not deleted. */
export async function listCutSheets(db: Database | Knex, projectId: string): Promise<CutSheetRead[]> {
  return withUploader(db).where('c.project_id', projectId).orderBy('c.uploaded_at');
}

export async function getCutSheet(db: Database | Knex, projectId: string, typeId: string): Promise<CutSheetRead | undefined> {
  const [row] = await withUploader(db).where({ 'c.project_id': projectId, 'c.luminaire_type_id': typeId });
  return row;
}

/** Records the type's cut sheet, replacing the row of the one it had. */
export async function putCutSheet(trx: Knex.Transaction, row: Omit<LuminaireCutSheetRow, 'uploaded_at'>): Promise<void> {
  await trx('luminaire_cut_sheets')
    .insert({ ...row, uploaded_at: trx.fn.now() })
    .onConflict('luminaire_type_id')
    .merge();
}

export async function deleteCutSheet(trx: Knex.Transaction, projectId: string, typeId: string): Promise<void> {
  await trx('luminaire_cut_sheets').where({ project_id: projectId, luminaire_type_id: typeId }).delete();
}

/** The file name of each type's cut sheet, by the type's tag: what the package lists. */
export async function cutSheetNamesByTag(db: Database | Knex, projectId: string): Promise<Map<string, string>> {
  const rows = await db('luminaire_cut_sheets as c')
    .join('luminaire_types as t', 't.id', 'c.luminaire_type_id')
    .where('c.project_id', projectId)
    .select<{ tag: string; file_name: string }[]>('t.tag', 'c.file_name');
  return new Map(rows.map((row) => [row.tag, row.file_name]));
}
