import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';

/** A name a spreadsheet used for a space type, and the code-table type the engineer matched it to. */
export interface ImportAlias {
  name: string;
  spaceType: string | null;
  buildingAreaType: string | null;
}

/** Case, dashes, slashes and spacing do not make two names different. */
export function foldName(name: string): string {
  return name
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[‐-―_/\\,.;:()[\]-]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

export async function listImportAliases(db: Knex, projectId: string): Promise<ImportAlias[]> {
  return db('project_import_aliases')
    .where({ project_id: projectId })
    .orderBy('name_key')
    .select<ImportAlias[]>('name', 'space_type as spaceType', 'building_area_type as buildingAreaType');
}

/** Remembers matches for the project; a name matched again replaces its earlier match. */
export async function saveImportAliases(db: Database, projectId: string, aliases: ImportAlias[], userId: string): Promise<ImportAlias[]> {
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const rows = [...new Map(aliases.map((alias) => [foldName(alias.name), alias])).entries()].map(([nameKey, alias]) => ({
      project_id: projectId,
      name_key: nameKey,
      name: alias.name,
      space_type: alias.spaceType,
      building_area_type: alias.buildingAreaType,
      updated_by: userId,
      updated_at: trx.fn.now(),
    }));
    if (rows.length > 0) await trx('project_import_aliases').insert(rows).onConflict(['project_id', 'name_key']).merge();
  });
  return listImportAliases(db, projectId);
}
