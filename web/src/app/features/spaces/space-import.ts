import Papa from 'papaparse';
import type {
  BuildingAreaTypeView,
  ComplianceMethod,
  ImportAlias,
  LuminaireTypeInput,
  LuminaireUse,
  SpaceInput,
  SpaceTypeView,
} from '../../core/api/api-types';
import type { ApiErrorDetail } from '../../core/http/api-error';
import { numberProblem, ranges } from '../../shared/number-range';
import { foldTypeName, matchTypeName, rememberedNames, type MatchKind, type TypeOption } from './space-import-match';

/** The space fields a spreadsheet column can fill. */
export type SpaceField = 'name' | 'level' | 'spaceType' | 'buildingAreaType' | 'area' | 'ceilingHeight' | 'length' | 'width';
/** A column of luminaire counts, headed by the type's tag. */
export type CountField = `count:${string}`;
export type ImportField = SpaceField | CountField;

export const importFields: readonly { field: SpaceField; label: string; aliases: readonly string[] }[] = [
  { field: 'name', label: 'Name', aliases: ['name', 'space', 'space name', 'room', 'room name'] },
  { field: 'level', label: 'Level', aliases: ['level', 'floor', 'storey', 'story'] },
  { field: 'spaceType', label: 'Space type', aliases: ['space type', 'type', 'space type key', 'use'] },
  { field: 'buildingAreaType', label: 'Building area type', aliases: ['building area type', 'building type', 'area type'] },
  { field: 'area', label: 'Floor area', aliases: ['area', 'floor area', 'sf', 'ft2', 'ft²', 'm2', 'm²', 'sq ft', 'square feet'] },
  { field: 'ceilingHeight', label: 'Ceiling height', aliases: ['ceiling height', 'ceiling', 'height'] },
  { field: 'length', label: 'Room length', aliases: ['length', 'room length'] },
  { field: 'width', label: 'Room width', aliases: ['width', 'room width'] },
];

export function countField(tag: string): CountField {
  return `count:${tag}`;
}

/** The tag a count column counts, or null for a space field. */
export function countTag(field: ImportField | null): string | null {
  return field?.startsWith('count:') ? field.slice('count:'.length) : null;
}

export function fieldLabel(field: ImportField): string {
  const tag = countTag(field);
  return tag === null ? importFields.find((entry) => entry.field === field)!.label : `Count of type ${tag}`;
}

export type ImportTable = string[][];
/** For each column of the sheet, the field it fills (or null to skip it). */
export type ColumnMapping = (ImportField | null)[];

/** One sheet of a workbook (a CSV file is a workbook of one sheet). */
export interface ImportSheet {
  name: string;
  table: ImportTable;
}

export type TypeKind = 'spaceType' | 'buildingAreaType';

export interface ImportRowProblem {
  field: ImportField | null;
  message: string;
  /** A type name the edition's table has no row for: the dialog lets the engineer say which type it means. */
  unknownName?: { kind: TypeKind; name: string };
}

export interface ImportRow {
  /** 1-based line in the sheet, counting the header. */
  line: number;
  values: Partial<Record<ImportField, string>>;
  space: SpaceInput;
  /** The type each name was matched to, and how. */
  matches: Partial<Record<TypeKind, { label: string; kind: MatchKind }>>;
  problems: ImportRowProblem[];
}

export interface ImportContext {
  method: ComplianceMethod;
  spaceTypes: readonly SpaceTypeView[];
  buildingAreaTypes: readonly BuildingAreaTypeView[];
  /** Names the project remembered from earlier imports. */
  aliases?: readonly ImportAlias[];
  /** Names matched in this import, folded (foldTypeName), to the type key chosen. */
  chosen?: Readonly<Record<TypeKind, ReadonlyMap<string, string>>>;
  /** Tags a count column may name: the project's types and those the import creates. */
  tags?: ReadonlySet<string>;
}

function normalise(text: string): string {
  return text
    .toLocaleLowerCase()
    .replace(/\(.*?\)/g, ' ')
    .replace(/[_\-.:]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'object') {
    const cell = value as { result?: unknown; text?: unknown; richText?: { text: string }[] };
    if (cell.result !== undefined) return cellText(cell.result);
    if (Array.isArray(cell.richText)) return cell.richText.map((part) => part.text).join('');
    if (cell.text !== undefined) return cellText(cell.text);
    return '';
  }
  return String(value).trim();
}

type ExcelModule = typeof import('exceljs');

/** exceljs ships a CommonJS bundle for browsers: its exports arrive as the default export there. Loaded on first use. */
async function loadExcel(): Promise<ExcelModule> {
  const loaded = (await import('exceljs')) as ExcelModule & { default?: ExcelModule };
  return loaded.default?.Workbook ? loaded.default : loaded;
}

function dropEmptyRows(table: ImportTable): ImportTable {
  return table.filter((row) => row.some((cell) => cell.trim() !== ''));
}

export function parseCsv(text: string): ImportTable {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  return dropEmptyRows(parsed.data.map((row) => row.map((cell) => cellText(cell))));
}

/** Every worksheet of an .xlsx, in order, as text cells. */
export async function parseXlsx(data: ArrayBuffer): Promise<ImportSheet[]> {
  const { Workbook } = await loadExcel();
  const workbook = new Workbook();
  await workbook.xlsx.load(data);
  return workbook.worksheets.map((sheet) => {
    const table: ImportTable = [];
    sheet.eachRow({ includeEmpty: false }, (row) => {
      const values = row.values as unknown[];
      const cells: string[] = [];
      for (let column = 1; column < values.length; column++) cells.push(cellText(values[column]));
      table.push(cells);
    });
    const width = Math.max(0, ...table.map((row) => row.length));
    return { name: sheet.name, table: dropEmptyRows(table.map((row) => [...row, ...Array<string>(width - row.length).fill('')])) };
  });
}

/** The sheets of a workbook, or the one sheet of a CSV file. */
export async function parseSpreadsheet(file: File): Promise<ImportSheet[]> {
  if (/\.xlsx$/i.test(file.name)) return parseXlsx(await file.arrayBuffer());
  if (/\.(csv|txt)$/i.test(file.name)) return [{ name: file.name, table: parseCsv(await file.text()) }];
  throw new Error('Choose an .xlsx workbook or a .csv file.');
}

/** Words that decorate a count column's header around the tag ("A1 (no.)", "Qty A1"). */
const countWords = new Set(['count', 'counts', 'qty', 'quantity', 'no', 'number']);

function headerTag(text: string, tags: readonly string[]): string | undefined {
  const bare = text
    .split(' ')
    .filter((word) => !countWords.has(word))
    .join(' ');
  return tags.find((tag) => normalise(tag) === bare);
}

/** Each header to the field whose name or alias it matches, or to the counts of a tag it names; every field is used at most once. */
export function guessMapping(
  headers: readonly string[],
  method: ComplianceMethod = 'space-by-space',
  tags: readonly string[] = [],
): ColumnMapping {
  const used = new Set<ImportField>();
  return headers.map((header) => {
    const text = normalise(header);
    const exact = importFields.find(
      ({ field, label, aliases }) => !used.has(field) && (normalise(label) === text || normalise(field) === text || aliases.includes(text)),
    );
    const tag = exact ? undefined : headerTag(text, tags);
    const loose =
      exact ??
      (tag === undefined
        ? importFields.find(({ field, aliases }) => !used.has(field) && aliases.some((alias) => alias.length > 3 && text.includes(alias)))
        : undefined);
    let field: ImportField | null = loose?.field ?? (tag !== undefined && !used.has(countField(tag)) ? countField(tag) : null);
    // A plain "type" column means whichever type the method uses.
    if (field === 'spaceType' && method === 'building-area' && !used.has('buildingAreaType') && text === 'type') field = 'buildingAreaType';
    if (field) used.add(field);
    return field;
  });
}

const optionalNumbers = [
  ['ceilingHeight', ranges.height],
  ['length', ranges.length],
  ['width', ranges.length],
] as const;

const typeKindWords: Record<TypeKind, string> = { spaceType: 'space type', buildingAreaType: 'building area type' };

/** The sheet's data rows as spaces, each with the problems the service would also find. */
export function buildRows(table: ImportTable, mapping: ColumnMapping, context: ImportContext): ImportRow[] {
  const remembered: Record<TypeKind, Map<string, string>> = {
    spaceType: rememberedNames(context.aliases ?? [], 'spaceType'),
    buildingAreaType: rememberedNames(context.aliases ?? [], 'buildingAreaType'),
  };
  const tables: Record<TypeKind, readonly TypeOption[]> = { spaceType: context.spaceTypes, buildingAreaType: context.buildingAreaTypes };
  const required: TypeKind = context.method === 'space-by-space' ? 'spaceType' : 'buildingAreaType';
  return table.slice(1).map((cells, index) => {
    const values: Partial<Record<ImportField, string>> = {};
    mapping.forEach((field, column) => {
      if (field) values[field] = (cells[column] ?? '').trim();
    });
    const problems: ImportRowProblem[] = [];
    const matches: ImportRow['matches'] = {};
    const space: SpaceInput = {
      name: values.name ?? '',
      area: values.area ?? '',
      luminaires: [],
      controls: [],
      windows: [],
      skylights: [],
    };
    if (values.level) space.level = values.level;

    if (!space.name) problems.push({ field: 'name', message: 'A name is required.' });
    if (!space.area) problems.push({ field: 'area', message: 'The floor area is required.' });
    else {
      const problem = numberProblem(space.area, ranges.area);
      if (problem) problems.push({ field: 'area', message: `Floor area: ${problem}` });
    }
    for (const [field, range] of optionalNumbers) {
      const raw = values[field];
      if (!raw) continue;
      const problem = numberProblem(raw, range);
      if (problem) problems.push({ field, message: `${fieldLabel(field)}: ${problem}` });
      else space[field] = raw;
    }

    // Both types are kept whatever the method (each method reads its own); the method's own is required.
    for (const kind of ['spaceType', 'buildingAreaType'] as const) {
      const text = values[kind] ?? '';
      if (!text) {
        if (kind === required)
          problems.push({
            field: kind,
            message: `The ${context.method === 'space-by-space' ? 'space-by-space' : 'building area'} method needs a ${typeKindWords[kind]}.`,
          });
        continue;
      }
      const chosenKey = context.chosen?.[kind].get(foldTypeName(text));
      const chosen = chosenKey === undefined ? undefined : tables[kind].find((type) => type.key === chosenKey);
      const match = chosen ? { type: chosen, kind: 'chosen' as const } : matchTypeName(text, tables[kind], remembered[kind]);
      if (match) {
        space[kind] = match.type.key;
        matches[kind] = { label: match.type.label, kind: match.kind };
      } else {
        problems.push({
          field: kind,
          message: `No ${typeKindWords[kind]} is called “${text}”: choose the type it means above.`,
          unknownName: { kind, name: text },
        });
      }
    }

    for (const field of mapping) {
      const tag = countTag(field);
      const raw = tag === null ? '' : (values[field!] ?? '');
      if (tag === null || raw === '') continue;
      const problem = numberProblem(raw, ranges.count);
      if (problem) problems.push({ field, message: `Count of ${tag}: ${problem}` });
      else if (context.tags && !context.tags.has(tag)) problems.push({ field, message: `No luminaire type is tagged “${tag}”.` });
      else if (Number(raw) > 0) space.luminaires.push({ tag, count: raw });
    }
    return { line: index + 2, values, space, matches, problems };
  });
}

/** The distinct names no type was found for, by kind, with how many rows use each. */
export function unknownNames(rows: readonly ImportRow[]): { kind: TypeKind; name: string; rows: number }[] {
  const found = new Map<string, { kind: TypeKind; name: string; rows: number }>();
  for (const row of rows) {
    for (const problem of row.problems) {
      if (!problem.unknownName) continue;
      const id = `${problem.unknownName.kind}:${foldTypeName(problem.unknownName.name)}`;
      const entry = found.get(id);
      if (entry) entry.rows++;
      else found.set(id, { ...problem.unknownName, rows: 1 });
    }
  }
  return [...found.values()];
}

/**
 * The names matched in the dialog, merged into what the project remembered under the same name,
 * so that remembering a space type keeps the building area type matched to that name (and back).
 */
export function aliasesToRemember(
  matched: readonly { kind: TypeKind; name: string; key: string }[],
  remembered: readonly ImportAlias[],
): ImportAlias[] {
  const byName = new Map<string, ImportAlias>(remembered.map((alias) => [foldTypeName(alias.name), alias]));
  const changed = new Map<string, ImportAlias>();
  for (const match of matched) {
    const folded = foldTypeName(match.name);
    const base = changed.get(folded) ?? byName.get(folded) ?? { name: match.name, spaceType: null, buildingAreaType: null };
    changed.set(folded, { ...base, name: match.name, [match.kind]: match.key });
  }
  return [...changed.values()];
}

/** The service's 400 paths (`spaces.3.area`) as problems on the rows they name. */
export function attachServerProblems(rows: readonly ImportRow[], details: readonly ApiErrorDetail[]): ImportRow[] {
  const byRow = new Map<number, ImportRowProblem[]>();
  for (const detail of details) {
    const match = /^spaces\.(\d+)(?:\.(\w+))?/.exec(detail.path);
    if (!match) continue;
    const index = Number(match[1]);
    const field = importFields.find((entry) => entry.field === match[2])?.field ?? null;
    byRow.set(index, [...(byRow.get(index) ?? []), { field, message: detail.message }]);
  }
  return rows.map((row, index) => (byRow.has(index) ? { ...row, problems: [...row.problems, ...byRow.get(index)!] } : row));
}

// ---------------------------------------------------------------- luminaire types

export type TypeField = 'tag' | 'description' | 'inputWatts' | 'use' | 'exemptReason';
export type TypeMapping = (TypeField | null)[];

export const typeFields: readonly { field: TypeField; label: string; aliases: readonly string[] }[] = [
  { field: 'tag', label: 'Tag', aliases: ['tag', 'type', 'type tag', 'mark', 'luminaire', 'luminaire type', 'fixture type'] },
  { field: 'description', label: 'Description', aliases: ['description', 'desc', 'luminaire description'] },
  {
    field: 'inputWatts',
    label: 'Rated input (W)',
    aliases: ['rated input', 'rated input watts', 'input watts', 'watts', 'w', 'wattage', 'input'],
  },
  { field: 'use', label: 'Use', aliases: ['use', 'lighting use', 'purpose'] },
  { field: 'exemptReason', label: 'Reason it is exempt', aliases: ['exempt reason', 'reason', 'exemption', 'reason exempt'] },
];

const useWords: Readonly<Record<string, LuminaireUse>> = {
  general: 'general',
  'general lighting': 'general',
  decorative: 'decorative',
  display: 'display',
  exempt: 'exempt',
};

export interface ImportTypeRow {
  line: number;
  values: Partial<Record<TypeField, string>>;
  type: LuminaireTypeInput;
  problems: { field: TypeField | null; message: string }[];
}

export function guessTypeMapping(headers: readonly string[]): TypeMapping {
  const used = new Set<TypeField>();
  return headers.map((header) => {
    const text = normalise(header);
    const entry = typeFields.find(({ field, label, aliases }) => !used.has(field) && (normalise(label) === text || aliases.includes(text)));
    if (entry) used.add(entry.field);
    return entry?.field ?? null;
  });
}

/** A sheet reads as luminaire types when it has a tag column and a rated input column. */
export function isTypeSheet(mapping: TypeMapping): boolean {
  return mapping.includes('tag') && mapping.includes('inputWatts');
}

/** The luminaire types of a sheet, each with the problems the service would also find (a tag the project already has is a clash). */
export function buildTypeRows(table: ImportTable, mapping: TypeMapping, projectTags: ReadonlySet<string>): ImportTypeRow[] {
  const seen = new Set<string>();
  return table.slice(1).map((cells, index) => {
    const values: Partial<Record<TypeField, string>> = {};
    mapping.forEach((field, column) => {
      if (field) values[field] = (cells[column] ?? '').trim();
    });
    const problems: ImportTypeRow['problems'] = [];
    const tag = values.tag ?? '';
    if (!tag) problems.push({ field: 'tag', message: 'A tag is required.' });
    else if (projectTags.has(tag))
      problems.push({
        field: 'tag',
        message: `The project already has a type tagged “${tag}”: rename it in the sheet or leave the row out.`,
      });
    else if (seen.has(tag)) problems.push({ field: 'tag', message: `The tag “${tag}” is on an earlier row too.` });
    seen.add(tag);
    const watts = values.inputWatts ?? '';
    const wattsProblem = watts === '' ? null : numberProblem(watts, ranges.luminaireWatts);
    if (watts === '') problems.push({ field: 'inputWatts', message: 'The rated input is required.' });
    else if (wattsProblem) problems.push({ field: 'inputWatts', message: `Rated input: ${wattsProblem}` });
    const useText = normalise(values.use ?? '');
    const use = useText === '' ? 'general' : useWords[useText];
    if (!use) problems.push({ field: 'use', message: `“${values.use}” is not a use: write general, decorative, display or exempt.` });
    const type: LuminaireTypeInput = {
      tag,
      description: values.description ?? '',
      inputWatts: watts,
      use: use ?? 'general',
      basis: 'rated',
    };
    if (use === 'exempt') {
      if (values.exemptReason) type.exemptReason = values.exemptReason;
      else problems.push({ field: 'exemptReason', message: 'Exempt lighting needs the reason it is exempt.' });
    }
    return { line: index + 2, values, type, problems };
  });
}

/** The service's 400 and 409 paths (`luminaireTypes.0.tag`) as problems on the type rows they name. */
export function attachServerTypeProblems(rows: readonly ImportTypeRow[], details: readonly ApiErrorDetail[]): ImportTypeRow[] {
  const byRow = new Map<number, ImportTypeRow['problems']>();
  for (const detail of details) {
    const match = /^luminaireTypes\.(\d+)(?:\.(\w+))?/.exec(detail.path);
    if (!match) continue;
    const index = Number(match[1]);
    const field = typeFields.find((entry) => entry.field === match[2])?.field ?? null;
    byRow.set(index, [...(byRow.get(index) ?? []), { field, message: detail.message }]);
  }
  return rows.map((row, index) => (byRow.has(index) ? { ...row, problems: [...row.problems, ...byRow.get(index)!] } : row));
}

// Template rows: invented examples; type keys from IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data.
const templateHeader = ['Name', 'Level', 'Space type', 'Building area type', 'Floor area', 'Ceiling height', 'Room length', 'Room width'];
const templateRows = [
  ['Office 101', 'Level 1', 'office-enclosed', '', '150', '9', '15', '10'],
  ['Corridor 1', 'Level 1', 'corridor-otherwise', '', '400', '9', '', ''],
];
// Invented example type and counts for the workbook's second sheet.
const templateTypeHeader = ['Tag', 'Description', 'Rated input (W)', 'Use'];
const templateTypeRows = [['A1', '2×4 LED troffer', '30', 'General lighting']];
const templateCounts = ['3', '4'];

export function templateCsv(): string {
  return Papa.unparse([templateHeader, ...templateRows]);
}

/** Spaces on the first sheet with a count column per type tag; the types on the second sheet. */
export async function templateXlsx(): Promise<ArrayBuffer> {
  const { Workbook } = await loadExcel();
  const workbook = new Workbook();
  const sheet = workbook.addWorksheet('Spaces');
  const tags = templateTypeRows.map(([tag]) => tag!);
  sheet.addRow([...templateHeader, ...tags]).font = { bold: true };
  templateRows.forEach((row, index) =>
    sheet.addRow([...row, templateCounts[index]!].map((cell, column) => (column >= 4 && cell !== '' ? Number(cell) : cell))),
  );
  sheet.columns.forEach((column) => (column.width = 20));
  const types = workbook.addWorksheet('Luminaire types');
  types.addRow(templateTypeHeader).font = { bold: true };
  templateTypeRows.forEach((row) => types.addRow(row.map((cell, column) => (column === 2 ? Number(cell) : cell))));
  types.columns.forEach((column) => (column.width = 24));
  return (await workbook.xlsx.writeBuffer()) as ArrayBuffer;
}
