import Papa from 'papaparse';
import type { BuildingAreaTypeView, ComplianceMethod, SpaceInput, SpaceTypeView } from '../../core/api/api-types';
import type { ApiErrorDetail } from '../../core/http/api-error';
import { quantityProblem } from './space-form';

/** The space fields a spreadsheet column can fill. */
export type ImportField = 'name' | 'level' | 'spaceType' | 'buildingAreaType' | 'area' | 'ceilingHeight' | 'length' | 'width';

export const importFields: readonly { field: ImportField; label: string; aliases: readonly string[] }[] = [
  { field: 'name', label: 'Name', aliases: ['name', 'space', 'space name', 'room', 'room name'] },
  { field: 'level', label: 'Level', aliases: ['level', 'floor', 'storey', 'story'] },
  { field: 'spaceType', label: 'Space type', aliases: ['space type', 'type', 'space type key', 'use'] },
  { field: 'buildingAreaType', label: 'Building area type', aliases: ['building area type', 'building type', 'area type'] },
  { field: 'area', label: 'Floor area', aliases: ['area', 'floor area', 'sf', 'ft2', 'ft²', 'm2', 'm²', 'sq ft', 'square feet'] },
  { field: 'ceilingHeight', label: 'Ceiling height', aliases: ['ceiling height', 'ceiling', 'height'] },
  { field: 'length', label: 'Room length', aliases: ['length', 'room length'] },
  { field: 'width', label: 'Room width', aliases: ['width', 'room width'] },
];

export type ImportTable = string[][];
/** For each column of the sheet, the field it fills (or null to skip it). */
export type ColumnMapping = (ImportField | null)[];

export interface ImportRowProblem {
  field: ImportField | null;
  message: string;
}

export interface ImportRow {
  /** 1-based line in the sheet, counting the header. */
  line: number;
  values: Partial<Record<ImportField, string>>;
  space: SpaceInput;
  problems: ImportRowProblem[];
}

export interface ImportContext {
  method: ComplianceMethod;
  spaceTypes: readonly SpaceTypeView[];
  buildingAreaTypes: readonly BuildingAreaTypeView[];
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

/** The first worksheet of an .xlsx, as text cells. */
export async function parseXlsx(data: ArrayBuffer): Promise<ImportTable> {
  const { Workbook } = await loadExcel();
  const workbook = new Workbook();
  await workbook.xlsx.load(data);
  const sheet = workbook.worksheets[0];
  if (!sheet) return [];
  const table: ImportTable = [];
  sheet.eachRow({ includeEmpty: false }, (row) => {
    const values = row.values as unknown[];
    const cells: string[] = [];
    for (let column = 1; column < values.length; column++) cells.push(cellText(values[column]));
    table.push(cells);
  });
  const width = Math.max(0, ...table.map((row) => row.length));
  return dropEmptyRows(table.map((row) => [...row, ...Array<string>(width - row.length).fill('')]));
}

export async function parseSpreadsheet(file: File): Promise<ImportTable> {
  if (/\.xlsx$/i.test(file.name)) return parseXlsx(await file.arrayBuffer());
  if (/\.(csv|txt)$/i.test(file.name)) return parseCsv(await file.text());
  throw new Error('Choose an .xlsx workbook or a .csv file.');
}

/** Each header to the field whose name or alias it matches; every field is used at most once. */
export function guessMapping(headers: readonly string[], method: ComplianceMethod = 'space-by-space'): ColumnMapping {
  const used = new Set<ImportField>();
  return headers.map((header) => {
    const text = normalise(header);
    const exact = importFields.find(({ field, label, aliases }) => !used.has(field) && (normalise(label) === text || normalise(field) === text || aliases.includes(text)));
    const loose = exact ?? importFields.find(({ field, aliases }) => !used.has(field) && aliases.some((alias) => alias.length > 3 && text.includes(alias)));
    let field = loose?.field ?? null;
    // A plain "type" column means whichever type the method uses.
    if (field === 'spaceType' && method === 'building-area' && !used.has('buildingAreaType') && text === 'type') field = 'buildingAreaType';
    if (field) used.add(field);
    return field;
  });
}

function lookup<T extends { key: string; label: string; sourceLabel: string }>(types: readonly T[], text: string): T | undefined {
  const wanted = text.trim().toLocaleLowerCase();
  return types.find((type) => type.key.toLocaleLowerCase() === wanted || type.label.toLocaleLowerCase() === wanted || type.sourceLabel.toLocaleLowerCase() === wanted);
}

const optionalNumbers: readonly ImportField[] = ['ceilingHeight', 'length', 'width'];

/** The sheet's data rows as spaces, each with the problems the service would also find. */
export function buildRows(table: ImportTable, mapping: ColumnMapping, context: ImportContext): ImportRow[] {
  return table.slice(1).map((cells, index) => {
    const values: Partial<Record<ImportField, string>> = {};
    mapping.forEach((field, column) => {
      if (field) values[field] = (cells[column] ?? '').trim();
    });
    const problems: ImportRowProblem[] = [];
    const space: SpaceInput = { name: values.name ?? '', area: values.area ?? '', luminaires: [], controls: [], windows: [], skylights: [] };
    if (values.level) space.level = values.level;

    if (!space.name) problems.push({ field: 'name', message: 'A name is required.' });
    if (!space.area) problems.push({ field: 'area', message: 'The floor area is required.' });
    else {
      const problem = quantityProblem(space.area, 'positive');
      if (problem) problems.push({ field: 'area', message: `Floor area: ${problem}` });
    }
    for (const field of optionalNumbers) {
      const raw = values[field];
      if (!raw) continue;
      const problem = quantityProblem(raw, 'positive');
      if (problem) problems.push({ field, message: `${importFields.find((entry) => entry.field === field)!.label}: ${problem}` });
      else space[field as 'ceilingHeight' | 'length' | 'width'] = raw;
    }

    if (context.method === 'space-by-space') {
      const text = values.spaceType ?? '';
      const type = text ? lookup(context.spaceTypes, text) : undefined;
      if (!text) problems.push({ field: 'spaceType', message: 'The space-by-space method needs a space type.' });
      else if (!type) problems.push({ field: 'spaceType', message: `No space type is called "${text}".` });
      else space.spaceType = type.key;
    } else {
      const text = values.buildingAreaType ?? '';
      const type = text ? lookup(context.buildingAreaTypes, text) : undefined;
      if (!text) problems.push({ field: 'buildingAreaType', message: 'The building area method needs a building area type.' });
      else if (!type) problems.push({ field: 'buildingAreaType', message: `No building area type is called "${text}".` });
      else space.buildingAreaType = type.key;
      const control = values.spaceType ? lookup(context.spaceTypes, values.spaceType) : undefined;
      if (values.spaceType && !control) problems.push({ field: 'spaceType', message: `No space type is called "${values.spaceType}".` });
      else if (control) space.controlSpaceType = control.key;
    }
    return { line: index + 2, values, space, problems };
  });
}

/** The service's 400 paths (`spaces.3.area`) as problems on the rows they name. */
export function attachServerProblems(rows: readonly ImportRow[], details: readonly ApiErrorDetail[]): ImportRow[] {
  const byRow = new Map<number, ImportRowProblem[]>();
  for (const detail of details) {
    const match = /^spaces\.(\d+)(?:\.(\w+))?/.exec(detail.path);
    if (!match) continue;
    const index = Number(match[1]);
    const field = (importFields.find((entry) => entry.field === match[2])?.field ?? null) as ImportField | null;
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

export function templateCsv(): string {
  return Papa.unparse([templateHeader, ...templateRows]);
}

export async function templateXlsx(): Promise<ArrayBuffer> {
  const { Workbook } = await loadExcel();
  const workbook = new Workbook();
  const sheet = workbook.addWorksheet('Spaces');
  sheet.addRow(templateHeader).font = { bold: true };
  templateRows.forEach((row) => sheet.addRow(row.map((cell, column) => (column >= 4 && cell !== '' ? Number(cell) : cell))));
  sheet.columns.forEach((column) => (column.width = 20));
  return (await workbook.xlsx.writeBuffer()) as ArrayBuffer;
}
