import ExcelJS from 'exceljs';
import type { Decimal } from 'decimal.js';
import JSZip from 'jszip';
import type { ControlLine, ExteriorApplicationResult, SpaceResult } from '../../../contract/result.js';
import { squareMetresPerSquareFootText } from '../../../contract/editions.js';
import { dec, sum, ZERO } from '../compliance/numbers.js';
import type { CompliancePackageOptions, PackageInput } from './package-input.js';
import {
  basisWords,
  confidenceWords,
  controlStatusWords,
  dateWords,
  editionWords,
  levelWords,
  methodWords,
  noteWords,
  orderedSpaces,
  providedWords,
  quantityUnit,
  requirementWords,
  spaceStatusWords,
  stateWords,
  unitSystemWords,
  unitWords,
  useWords,
  verdictWords,
  withinWords,
} from './package-words.js';

/**
 * The compliance workbook: one sheet per part of the evaluation, the allowances, installed watts,
 * margins and totals as live formulas (area × LPD, count × watts, SUMIFS by space and by level,
 * SUM over each table's column) whose cached results are the engine's values, so the file opens
 * with the engine's figures and a reviewer who changes an input sees the effect.
 *
 * Each table's data rows after the first are written as sheet XML after packing (`withLaterRows`),
 * unless `rowsViaExceljs` asks for every row as exceljs cells, the reference the tests compare with.
 *
 * Pure: reads only its input, no clock, no network.
 */
export async function buildComplianceWorkbook(input: PackageInput, options: CompliancePackageOptions = {}): Promise<Buffer> {
  const { project, result, revision } = input;
  const workbook = new ExcelJS.Workbook();
  const later: LaterRows[] = [];
  if (!options.rowsViaExceljs) laterRows.set(workbook, later);
  workbook.creator = revision.madeBy;
  workbook.title = `${project.name}: lighting compliance workbook, revision ${revision.number}`;
  workbook.created = new Date(revision.madeAt);
  workbook.modified = new Date(revision.madeAt);
  workbook.calcProperties.fullCalcOnLoad = true;

  const formats = numberFormats(result.units);
  // The sheets in reading order; each is filled below, the Summary last because it refers to the others.
  const summary = workbook.addWorksheet('Summary');
  const spacesSheet = workbook.addWorksheet('Spaces');
  const luminairesSheet = workbook.addWorksheet('Luminaires');
  const countsSheet = workbook.addWorksheet('Counts');
  const controlsSheet = workbook.addWorksheet('Controls');
  const daylightSheet = workbook.addWorksheet('Daylight');
  const exteriorSheet = workbook.addWorksheet('Exterior');
  const sourcesSheet = workbook.addWorksheet('Sources');

  const spaces = orderedSpaces(result);
  const numberOf = new Map(spaces.map((space, index) => [space.id, index + 1]));

  const counts = writeCounts(countsSheet, spaces, formats);
  const spaceTable = writeSpaces(spacesSheet, spaces, counts, formats, result.units);
  writeLuminaires(luminairesSheet, input, counts, formats, options);
  const controls = writeControls(controlsSheet, input, numberOf);
  writeDaylight(daylightSheet, spaces, formats);
  const exterior = writeExterior(exteriorSheet, input, formats);
  writeSources(sourcesSheet, input);
  writeSummary(summary, input, spaceTable, controls, exterior, formats);
  for (const sheet of workbook.worksheets) printed(sheet, input);
  shareStyles(workbook);

  // Light compression: a large workbook is written in a fraction of the time, for a file a little larger.
  const buffer = await workbook.xlsx.writeBuffer({
    zip: { compression: 'DEFLATE', compressionOptions: { level: 1 } },
  } as ExcelJS.XlsxWriteOptions);
  return later.length === 0 ? Buffer.from(buffer) : withLaterRows(Buffer.from(buffer), later);
}

// ---------------------------------------------------------------- rows written after packing

/**
 * A table's data rows after its first, written into the sheet's XML after exceljs has packed the
 * workbook. exceljs keeps a model of every cell and renders each through many small strings: for
 * a 5,000-space project that took most of the build's time and memory.
 */
interface LaterRows {
  sheet: ExcelJS.Worksheet;
  /** The table's first data row: exceljs writes it, and its cells give each column's style in the file. */
  first: number;
  /** The rows that follow it, from row first + 1. */
  rows: Cell[][];
}

/** The rows left for after packing, by workbook; a workbook not listed has every row written by exceljs. */
const laterRows = new WeakMap<ExcelJS.Workbook, LaterRows[]>();

/** Puts the later rows into their sheets' XML, their strings into the shared strings, and packs the workbook again. */
async function withLaterRows(packed: Buffer, later: LaterRows[]): Promise<Buffer> {
  const zip = await JSZip.loadAsync(packed);
  const part = async (name: string) => {
    const entry = zip.file(name);
    if (entry === null) throw new Error(`the packed workbook has no ${name}`);
    return entry.async('string');
  };
  const strings = new SharedStrings(await part('xl/sharedStrings.xml'));
  for (const sheet of new Set(later.map((rows) => rows.sheet))) {
    // exceljs names each sheet's part by the sheet's id.
    const name = `xl/worksheets/sheet${sheet.id}.xml`;
    let xml = await part(name);
    for (const rows of later) if (rows.sheet === sheet) xml = withRows(xml, rows, strings);
    zip.file(name, xml);
  }
  zip.file('xl/sharedStrings.xml', strings.xml());
  // Parts left as they were keep exceljs's compressed data; the ones replaced are compressed as exceljs does.
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 1 } });
}

/** The sheet's XML with the rows after the table's first data row, and its dimension widened to them. */
function withRows(xml: string, later: LaterRows, strings: SharedStrings): string {
  const start = xml.indexOf(`<row r="${later.first}" `);
  const end = start < 0 ? -1 : xml.indexOf('</row>', start);
  if (end < 0) throw new Error(`row ${later.first} of ${later.sheet.name} is missing from the packed workbook`);
  const after = end + '</row>'.length;
  const styles: (string | undefined)[] = [];
  for (const match of xml.slice(start, after).matchAll(/<c r="([A-Z]+)\d+"(?: s="(\d+)")?/g)) {
    styles[columnNumber(match[1]!)] = match[2];
  }
  const parts: string[] = [];
  let lastRow = 0;
  let lastColumn = 0;
  later.rows.forEach((values, index) => {
    const row = later.first + 1 + index;
    const written = rowXml(row, values, styles, strings);
    if (written === null) return;
    parts.push(written.xml);
    lastRow = row;
    lastColumn = Math.max(lastColumn, written.last);
  });
  const body = xml.slice(0, after) + parts.join('') + xml.slice(after);
  return body.replace(/<dimension ref="([A-Z]+\d+)(?::([A-Z]+)(\d+))?"\/>/, (_whole, from: string, toColumn?: string, toRow?: string) => {
    const column = Math.max(toColumn === undefined ? columnNumber(from.replace(/\d+/, '')) : columnNumber(toColumn), lastColumn);
    const row = Math.max(toRow === undefined ? Number(from.replace(/[A-Z]+/, '')) : Number(toRow), lastRow);
    return `<dimension ref="${from}:${letter(column)}${row}"/>`;
  });
}

/**
 * One row as exceljs writes it: each cell with its address, the column's style, and its value: a
 * number, a shared string, or a formula with its cached result. Null when the row has no cells
 * (exceljs leaves such a row out).
 */
function rowXml(row: number, values: Cell[], styles: (string | undefined)[], strings: SharedStrings): { xml: string; last: number } | null {
  let cells = '';
  let first = 0;
  let last = 0;
  values.forEach((value, index) => {
    const column = index + 1;
    const style = styles[column];
    const head = `<c r="${letter(column)}${row}"${style === undefined ? '' : ` s="${style}"`}`;
    let cell: string;
    if (value === null || value === undefined) {
      if (style === undefined) return;
      cell = `${head}/>`;
    } else if (typeof value === 'number') {
      cell = `${head}><v>${value}</v></c>`;
    } else if (typeof value === 'string') {
      cell = `${head} t="s"><v>${strings.index(value)}</v></c>`;
    } else if (typeof value === 'boolean') {
      cell = `${head} t="b"><v>${value ? 1 : 0}</v></c>`;
    } else if (typeof value === 'object' && 'formula' in value && value.formula !== undefined) {
      const cached = value.result;
      const text = escapeXml(value.formula);
      if (typeof cached === 'number') cell = `${head}><f>${text}</f><v>${cached}</v></c>`;
      else if (typeof cached === 'string') cell = `${head} t="str"><f>${text}</f><v>${escapeXml(cached)}</v></c>`;
      else if (typeof cached === 'boolean') cell = `${head} t="b"><f>${text}</f><v>${cached ? 1 : 0}</v></c>`;
      else throw new Error(`the formula of ${letter(column)}${row} has a cached result the workbook does not write`);
    } else {
      throw new Error(`${letter(column)}${row} holds a value the workbook does not write`);
    }
    if (first === 0) first = column;
    last = column;
    cells += cell;
  });
  if (first === 0) return null;
  return { xml: `<row r="${row}" spans="${first}:${last}" x14ac:dyDescent="0.25">${cells}</row>`, last };
}

/** The workbook's shared strings as exceljs wrote them, and the later rows' strings added after them. */
class SharedStrings {
  private readonly open: string;
  private readonly before: string;
  private readonly written: string;
  private readonly added: string[] = [];
  /** Each plain entry's index by its text as written in the file (escaped), so that strings stored alike are one entry. */
  private readonly indexOf = new Map<string, number>();
  private count: number;
  private unique = 0;

  constructor(xml: string) {
    const open = /<sst [^>]*>/.exec(xml);
    const close = xml.lastIndexOf('</sst>');
    if (open === null || close < 0) throw new Error('the packed workbook has shared strings that are not an <sst> element');
    this.before = xml.slice(0, open.index);
    this.open = open[0];
    this.written = xml.slice(open.index + open[0].length, close);
    this.count = Number(/ count="(\d+)"/.exec(open[0])?.[1] ?? 0);
    // A plain entry is a <t> alone; any other (rich text) takes its place in the count and is not reused.
    for (const match of this.written.matchAll(/<si>(?:<t(?: xml:space="preserve")?>([^<]*)<\/t><\/si>|[\s\S]*?<\/si>)/g)) {
      if (match[1] !== undefined && !this.indexOf.has(match[1])) this.indexOf.set(match[1], this.unique);
      this.unique += 1;
    }
  }

  /** The string's index, added when it is new. */
  index(text: string): number {
    this.count += 1;
    const escaped = escapeXml(text);
    let index = this.indexOf.get(escaped);
    if (index === undefined) {
      index = this.unique;
      this.unique += 1;
      this.indexOf.set(escaped, index);
      // exceljs keeps a string's leading or trailing space and line breaks the same way.
      const preserve = /^\s|\n|\s$/.test(text) ? ' xml:space="preserve"' : '';
      this.added.push(`<si><t${preserve}>${escaped}</t></si>`);
    }
    return index;
  }

  xml(): string {
    const open = this.open.replace(/ count="\d+"/, ` count="${this.count}"`).replace(/ uniqueCount="\d+"/, ` uniqueCount="${this.unique}"`);
    return `${this.before}${open}${this.written}${this.added.join('')}</sst>`;
  }
}

const xmlEscapes: Record<string, string> = { '"': '&quot;', '&': '&amp;', "'": '&apos;', '<': '&lt;', '>': '&gt;' };

/** Text escaped as exceljs escapes it: the five XML entities, and the control characters XML 1.0 has no place for dropped. */
function escapeXml(text: string): string {
  // eslint-disable-next-line no-control-regex -- these very characters are what is matched
  return text.replace(/[<>&'"\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g, (char) => xmlEscapes[char] ?? '');
}

/**
 * Gives cells that look alike one style object. exceljs gives every cell a style object of its
 * own and, when writing, renders each one's XML to find its style in the file, unless it saw that
 * very object before; shared objects cut that work for a 5,000-space workbook by seconds. Run last:
 * a later change to one cell's style would reach every cell sharing it.
 */
function shareStyles(workbook: ExcelJS.Workbook): void {
  // Each part (font, alignment …) by its content; an object several cells share is read once.
  const words = new WeakMap<object, string>();
  const idOf = (part: object | undefined): string => {
    if (part === undefined) return '';
    let id = words.get(part);
    if (id === undefined) {
      id = JSON.stringify(part);
      words.set(part, id);
    }
    return id;
  };
  const shared = new Map<string, Partial<ExcelJS.Style>>();
  for (const sheet of workbook.worksheets) {
    sheet.eachRow({ includeEmpty: true }, (row) => {
      row.eachCell({ includeEmpty: true }, (cell) => {
        const style = cell.style;
        const keys = Object.keys(style);
        // A style of other parts than these is left as it is.
        if (keys.some((key) => !['numFmt', 'font', 'alignment', 'fill', 'border', 'protection'].includes(key))) return;
        // Without a number format, the file's style depends on the kind of value (a number gets General).
        const key = [
          style.numFmt ?? `type ${cell.type}`,
          idOf(style.font),
          idOf(style.alignment),
          idOf(style.fill),
          idOf(style.border),
          idOf(style.protection),
        ].join('\u0000');
        const known = shared.get(key);
        if (known === undefined) shared.set(key, style);
        else cell.style = known;
      });
    });
  }
}

// ---------------------------------------------------------------- printing

/** The draft mark in the printed header of a draft, the fingerprint in every printed footer, landscape and one page wide. */
function printed(sheet: ExcelJS.Worksheet, input: PackageInput): void {
  const escape = (text: string) => text.replace(/&/g, '&&');
  const title = `${escape(input.project.name)} · ${sheet.name} · Revision ${input.revision.number}`;
  sheet.headerFooter = {
    oddHeader: input.revision.draft ? `&L${title}&R&"-,Bold"DRAFT — not for permit` : `&L${title}`,
    oddFooter: `&LFingerprint ${input.revision.fingerprint}&RPage &P of &N`,
  };
  sheet.pageSetup = { ...sheet.pageSetup, orientation: 'landscape', fitToPage: true, fitToWidth: 1, fitToHeight: 0, printTitlesRow: '1:1' };
}

// ---------------------------------------------------------------- formats and cells

interface Formats {
  watts: string;
  area: string;
  density: string;
  count: string;
  unitWatts: string;
  percent: string;
  length: string;
  quantity: string;
  rate: string;
}

function numberFormats(units: PackageInput['result']['units']): Formats {
  const words = unitWords(units);
  return {
    watts: '#,##0 "W"',
    area: units === 'ip' ? `#,##0 "${words.area}"` : `#,##0.0 "${words.area}"`,
    density: `0.00 "${words.density}"`,
    count: '#,##0.##',
    unitWatts: '#,##0.0 "W"',
    percent: '0.0%',
    length: `#,##0.00 "${words.length}"`,
    quantity: '#,##0.##',
    rate: '#,##0.000',
  };
}

type Cell = ExcelJS.CellValue;

function formula(text: string, result: number | string): Cell {
  return { formula: text, result } as ExcelJS.CellFormulaValue;
}

function num(value: string | Decimal): number {
  return Number(typeof value === 'string' ? value : value.toString());
}

/** The number of a column by its letters: A is 1, AA is 27. */
function columnNumber(letters: string): number {
  let number = 0;
  for (const char of letters) number = number * 26 + (char.charCodeAt(0) - 64);
  return number;
}

function letter(column: number): string {
  let text = '';
  let rest = column;
  while (rest > 0) {
    const digit = (rest - 1) % 26;
    text = String.fromCharCode(65 + digit) + text;
    rest = Math.floor((rest - 1) / 26);
  }
  return text;
}

/** Words for the verdict cells; the conditional formats colour them by these. */
const goodWords = ['Within allowance', 'Met', 'Complies', 'Exception claimed'];
const badWords = ['Over allowance', 'Not met', 'Does not comply'];
const openWords = ['To verify', 'No luminaires entered', 'Incomplete'];

const fills = {
  good: 'FFCDEBE4',
  bad: 'FFF6CFC4',
  open: 'FFFFF0BF',
};

function verdictFormatting(sheet: ExcelJS.Worksheet, ref: string): void {
  const first = ref.split(':')[0]!;
  const rule = (words: string[], color: string, priority: number): ExcelJS.ConditionalFormattingRule => ({
    type: 'expression',
    priority,
    formulae: [`OR(${words.map((word) => `LEFT(${first},${word.length})="${word}"`).join(',')})`],
    style: { fill: { type: 'pattern', pattern: 'solid', bgColor: { argb: color } }, font: { bold: true } },
  });
  sheet.addConditionalFormatting({
    ref,
    rules: [rule(badWords, fills.bad, 1), rule(openWords, fills.open, 2), rule(goodWords, fills.good, 3)],
  });
}

interface ColumnSpec {
  header: string;
  width: number;
  numFmt?: string;
  /** A SUM over the column in the table's totals row, with the engine's value as its cached result. */
  total?: number;
  wrap?: boolean;
}

interface TableSpec {
  name: string;
  /** The header row's number. */
  top: number;
  columns: ColumnSpec[];
  rows: Cell[][];
  /** What the sheet says in place of an empty table. */
  empty: string;
  freezeColumns?: number;
}

interface WrittenTable {
  /** First and last data rows; last < first when the table is empty. */
  first: number;
  last: number;
  totalsRow: number | null;
  /** `Sheet!$C$2:$C$9` for a column, by its 1-based index; null when the table is empty. */
  range(column: number): string | null;
  cell(column: number, row: number): string;
}

/**
 * A named Excel table with a header row (filter buttons), the data, and a totals row where a
 * column asks for one, its column widths and number formats set and the header row frozen.
 */
function writeTable(sheet: ExcelJS.Worksheet, spec: TableSpec): WrittenTable {
  spec.columns.forEach((column, index) => {
    sheet.getColumn(index + 1).width = column.width;
  });
  sheet.views = [{ state: 'frozen', ySplit: spec.top, xSplit: spec.freezeColumns ?? 0 }];
  const first = spec.top + 1;
  const last = spec.top + spec.rows.length;
  const sheetName = sheet.name;
  const written: WrittenTable = {
    first,
    last,
    totalsRow: null,
    range: (column) => (last < first ? null : `${sheetName}!$${letter(column)}$${first}:$${letter(column)}$${last}`),
    cell: (column, row) => `${letter(column)}${row}`,
  };
  if (spec.rows.length === 0) {
    const header = sheet.getRow(spec.top);
    spec.columns.forEach((column, index) => {
      header.getCell(index + 1).value = column.header;
    });
    header.font = { bold: true };
    sheet.getCell(first, 1).value = spec.empty;
    return written;
  }
  const withTotals = spec.columns.some((column) => column.total !== undefined);
  // With the rows after the first left for after packing, exceljs still gets a row for each (the
  // table's range follows their number) but cells only in the first.
  const later = spec.rows.length > 1 ? laterRows.get(sheet.workbook) : undefined;
  later?.push({ sheet, first, rows: spec.rows.slice(1) });
  const lastInModel = later === undefined ? last : first;
  sheet.addTable({
    name: spec.name,
    ref: `A${spec.top}`,
    headerRow: true,
    totalsRow: withTotals,
    style: { theme: 'TableStyleLight9', showRowStripes: true },
    columns: spec.columns.map((column, index) => ({
      name: column.header,
      filterButton: true,
      ...(withTotals && index === 0 ? { totalsRowLabel: 'Total' } : {}),
      ...(column.total !== undefined ? { totalsRowFunction: 'custom' as const, totalsRowFormula: sumOf(index + 1, first, last) } : {}),
    })),
    rows: later === undefined ? spec.rows : spec.rows.map((row, index) => (index === 0 ? row : [])),
  });
  spec.columns.forEach((column, index) => {
    if (column.numFmt === undefined && !column.wrap) return;
    const style = (): Partial<ExcelJS.Style> => ({
      ...(column.numFmt !== undefined ? { numFmt: column.numFmt } : {}),
      ...(column.wrap ? { alignment: { wrapText: true, vertical: 'top' } } : {}),
    });
    // One style object for the column's data cells (nothing changes their style afterwards), so
    // exceljs renders it once; the totals row's cells get their own, as the row is made bold below.
    const shared = style();
    for (let row = first; row <= lastInModel; row++) sheet.getCell(row, index + 1).style = shared;
    if (withTotals) sheet.getCell(last + 1, index + 1).style = style();
  });
  if (withTotals) {
    const totals = last + 1;
    written.totalsRow = totals;
    spec.columns.forEach((column, index) => {
      if (column.total === undefined) return;
      sheet.getCell(totals, index + 1).value = formula(sumOf(index + 1, first, last), column.total);
    });
    sheet.getRow(totals).font = { bold: true };
  }
  return written;
}

function sumOf(column: number, first: number, last: number): string {
  return `SUM(${letter(column)}${first}:${letter(column)}${last})`;
}

// ---------------------------------------------------------------- the factors behind the formulas

/**
 * The factor a formula multiplies by (an LPD, a unit wattage, an exterior rate) so that
 * quantity × factor (+ extra) gives the engine's watts to its reported 0.1 W. The result carries
 * each factor rounded (LPDs to 0.001, unit watts to 0.1 W); where that rounding would move the
 * product by more than the engine's own rounding, the factor is taken from the engine's watts.
 */
function factorFor(quantity: Decimal, candidates: Decimal[], target: Decimal, extra: Decimal = ZERO): number {
  for (const candidate of candidates) {
    if (quantity.times(candidate).plus(extra).minus(target).abs().lessThanOrEqualTo('0.05')) return num(candidate);
  }
  if (quantity.isZero()) return num(candidates[0] ?? ZERO);
  return target.minus(extra).dividedBy(quantity).toNumber();
}

/** A space's allowed LPD in the project's units, such that area × LPD + additional is the engine's allowance. */
function lpdFactor(space: SpaceResult, units: PackageInput['result']['units']): number {
  const area = dec(space.area);
  const reportedLpd = dec(space.allowedLpd);
  const candidates = [reportedLpd];
  if (units === 'si') {
    // The tables are per ft²: the SI figure converted back and rounded to 0.0001 W/ft² is the table's value.
    const squareMetres = dec(squareMetresPerSquareFootText);
    const tableLpd = reportedLpd.times(squareMetres).toDecimalPlaces(4);
    candidates.push(tableLpd.dividedBy(squareMetres));
  }
  return factorFor(area, candidates, dec(space.allowanceW), dec(space.additionalAllowanceW));
}

// ---------------------------------------------------------------- Counts

interface CountsTable {
  table: WrittenTable;
  /** Column numbers. */
  columns: { number: number; tag: number; use: number; count: number; watts: number };
}

const exemptUse = 'Exempt';

function writeCounts(sheet: ExcelJS.Worksheet, spaces: SpaceResult[], formats: Formats): CountsTable {
  const rows: Cell[][] = [];
  let total = ZERO;
  spaces.forEach((space, index) => {
    for (const line of space.luminaires) {
      const row = 2 + rows.length;
      const count = dec(line.count);
      const unitWatts = factorFor(count, [dec(line.unitWatts)], dec(line.watts));
      total = total.plus(line.watts);
      rows.push([
        index + 1,
        levelWords(space.level),
        space.name,
        line.tag,
        useWords(line.use),
        num(count),
        unitWatts,
        formula(`F${row}*G${row}`, num(line.watts)),
        line.basis,
        line.zone ? zoneName(line.zone) : '',
      ]);
    }
  });
  const table = writeTable(sheet, {
    name: 'LuminaireCounts',
    top: 1,
    freezeColumns: 4,
    empty: 'No luminaires are entered in any space.',
    columns: [
      { header: 'Space no.', width: 10 },
      { header: 'Level', width: 14 },
      { header: 'Space', width: 30 },
      { header: 'Type', width: 10 },
      { header: 'Use', width: 16 },
      { header: 'Count', width: 10, numFmt: formats.count },
      { header: 'Watts each', width: 13, numFmt: formats.unitWatts },
      { header: 'Watts', width: 12, numFmt: formats.watts, total: num(total) },
      { header: 'How the watts are counted', width: 44, wrap: true },
      { header: 'Daylight zone', width: 18 },
    ],
    rows,
  });
  return { table, columns: { number: 1, tag: 4, use: 5, count: 6, watts: 8 } };
}

function zoneName(zone: string): string {
  return zone === 'primary-sidelit' ? 'Primary sidelit' : zone === 'secondary-sidelit' ? 'Secondary sidelit' : 'Toplit';
}

// ---------------------------------------------------------------- Spaces

interface SpacesTable {
  table: WrittenTable;
  columns: { level: number; area: number; counted: number; installed: number; exempt: number; margin: number };
}

function writeSpaces(
  sheet: ExcelJS.Worksheet,
  spaces: SpaceResult[],
  counts: CountsTable,
  formats: Formats,
  units: PackageInput['result']['units'],
): SpacesTable {
  const watts = counts.table.range(counts.columns.watts);
  const numbers = counts.table.range(counts.columns.number);
  const uses = counts.table.range(counts.columns.use);
  const unlit = spaceStatusWords({ lighting: 'unlit', withinAllowance: true });
  const noneEntered = spaceStatusWords({ lighting: 'none-entered', withinAllowance: true });
  const rows: Cell[][] = spaces.map((space, index) => {
    const row = 2 + index;
    const counted = space.lighting === 'unlit' ? '0' : space.allowanceW;
    const installedFormula = watts === null ? '0' : `SUMIFS(${watts},${numbers},A${row},${uses},"<>${exemptUse}")`;
    const exemptFormula = watts === null ? '0' : `SUMIFS(${watts},${numbers},A${row},${uses},"${exemptUse}")`;
    return [
      index + 1,
      levelWords(space.level),
      space.name,
      space.lpdBasis.label,
      num(space.area),
      lpdFactor(space, units),
      num(space.additionalAllowanceW),
      formula(`E${row}*F${row}+G${row}`, num(space.allowanceW)),
      formula(`IF(P${row}="${unlit}",0,H${row})`, num(counted)),
      formula(installedFormula, num(space.installedW)),
      formula(exemptFormula, num(space.exemptW)),
      formula(`IF(E${row}>0,J${row}/E${row},0)`, num(space.installedLpd)),
      formula(`H${row}-J${row}`, num(space.marginW)),
      formula(`IF(H${row}>0,M${row}/H${row},"")`, space.marginPct === null ? '' : num(dec(space.marginPct).dividedBy(100))),
      space.roomGeometryIncreaseApplied ? 'Yes' : 'No',
      // The lighting state is an input; the status follows the watts while luminaires are entered.
      space.lighting === 'entered'
        ? formula(`IF(J${row}<=H${row},"${withinWords(true)}","${withinWords(false)}")`, spaceStatusWords(space))
        : space.lighting === 'unlit'
          ? unlit
          : noneEntered,
    ];
  });
  const total = (pick: (space: SpaceResult) => string) => num(sum(spaces.map((space) => dec(pick(space)))));
  const table = writeTable(sheet, {
    name: 'SpaceAllowances',
    top: 1,
    freezeColumns: 3,
    empty: 'The project has no spaces.',
    columns: [
      { header: 'Space no.', width: 10 },
      { header: 'Level', width: 14 },
      { header: 'Space', width: 30 },
      { header: 'LPD basis', width: 30 },
      { header: 'Area', width: 12, numFmt: formats.area, total: num(sum(spaces.map((space) => dec(space.area)))) },
      { header: 'Allowed LPD', width: 14, numFmt: formats.density },
      { header: 'Additional allowance', width: 14, numFmt: formats.watts, total: total((space) => space.additionalAllowanceW) },
      { header: 'Allowance', width: 13, numFmt: formats.watts, total: total((space) => space.allowanceW) },
      {
        header: 'Allowance counted',
        width: 14,
        numFmt: formats.watts,
        total: total((space) => (space.lighting === 'unlit' ? '0' : space.allowanceW)),
      },
      { header: 'Installed', width: 13, numFmt: formats.watts, total: total((space) => space.installedW) },
      { header: 'Exempt', width: 12, numFmt: formats.watts, total: total((space) => space.exemptW) },
      { header: 'Installed LPD', width: 14, numFmt: formats.density },
      { header: 'Margin', width: 12, numFmt: formats.watts, total: total((space) => space.marginW) },
      { header: 'Margin share', width: 12, numFmt: formats.percent },
      { header: 'Room-geometry increase', width: 14 },
      { header: 'Status', width: 22 },
    ],
    rows,
  });
  if (rows.length > 0) verdictFormatting(sheet, `P2:P${table.last}`);
  return { table, columns: { level: 2, area: 5, counted: 9, installed: 10, exempt: 11, margin: 13 } };
}

// ---------------------------------------------------------------- Luminaires

function writeLuminaires(
  sheet: ExcelJS.Worksheet,
  input: PackageInput,
  counts: CountsTable,
  formats: Formats,
  options: CompliancePackageOptions,
): void {
  const tags = counts.table.range(counts.columns.tag);
  const countRange = counts.table.range(counts.columns.count);
  const watts = counts.table.range(counts.columns.watts);
  const lines = input.result.interior.spaces.flatMap((space) => space.luminaires);
  const types = [...input.document.luminaireTypes].sort((a, b) => a.tag.localeCompare(b.tag, 'en-US', { numeric: true }));
  const rows: Cell[][] = types.map((type, index) => {
    const row = 2 + index;
    const own = lines.filter((line) => line.tag === type.tag);
    const count = sum(own.map((line) => dec(line.count)));
    const total = sum(own.map((line) => dec(line.watts)));
    return [
      type.tag,
      type.description,
      num(type.inputWatts),
      basisWords(type.basis),
      useWords(type.use),
      type.exemptReason ?? '',
      tags === null ? 0 : formula(`SUMIFS(${countRange},${tags},A${row})`, num(count)),
      tags === null ? 0 : formula(`SUMIFS(${watts},${tags},A${row})`, num(total)),
      options.cutSheets?.get(type.tag) ?? 'None on file',
    ];
  });
  writeTable(sheet, {
    name: 'LuminaireSchedule',
    top: 1,
    freezeColumns: 1,
    empty: 'No luminaire types are entered.',
    columns: [
      { header: 'Type', width: 10 },
      { header: 'Description', width: 40, wrap: true },
      { header: 'Rated input', width: 13, numFmt: formats.unitWatts },
      { header: 'Wattage basis', width: 30 },
      { header: 'Use', width: 16 },
      { header: 'Why exempt', width: 30, wrap: true },
      { header: 'Count in spaces', width: 14, numFmt: formats.count },
      { header: 'Watts in spaces', width: 14, numFmt: formats.watts, total: num(sum(lines.map((line) => dec(line.watts)))) },
      { header: 'Cut sheet', width: 30, wrap: true },
    ],
    rows,
  });
}

// ---------------------------------------------------------------- Controls

interface ControlsTable {
  table: WrittenTable;
  status: number;
  lines: ControlLine[];
}

function writeControls(sheet: ExcelJS.Worksheet, input: PackageInput, numberOf: Map<string, number>): ControlsTable {
  const documentSpaces = new Map(input.document.spaces.map((space) => [space.id, space]));
  const rows: Cell[][] = [];
  const lines: ControlLine[] = [];
  for (const space of orderedSpaces(input.result)) {
    const provided = documentSpaces.get(space.id)?.controls ?? [];
    for (const line of space.controls) {
      lines.push(line);
      rows.push([
        numberOf.get(space.id) ?? '',
        levelWords(space.level),
        space.name,
        line.label,
        requirementWords(line.requirement),
        providedWords(provided.find((control) => control.strategy === line.strategy)),
        controlStatusWords(line.status),
        line.reason,
        line.section,
      ]);
    }
  }
  const entries = new Map(input.document.exterior?.applications.map((entry) => [entry.key, entry]) ?? []);
  for (const application of input.result.exterior?.applications ?? []) {
    const provided = entries.get(application.key)?.controls ?? [];
    for (const line of application.controls) {
      lines.push(line);
      rows.push([
        '',
        'Exterior',
        application.label,
        line.label,
        requirementWords(line.requirement),
        providedWords(provided.find((control) => control.strategy === line.strategy)),
        controlStatusWords(line.status),
        line.reason,
        line.section,
      ]);
    }
  }
  const table = writeTable(sheet, {
    name: 'ControlRequirements',
    top: 1,
    freezeColumns: 3,
    empty: 'No control requirements apply.',
    columns: [
      { header: 'Space no.', width: 10 },
      { header: 'Level', width: 14 },
      { header: 'Space or application', width: 30 },
      { header: 'Requirement', width: 30 },
      { header: 'Required', width: 16 },
      { header: 'Provided', width: 40, wrap: true },
      { header: 'Status', width: 18 },
      { header: 'Why', width: 60, wrap: true },
      { header: 'Section', width: 22 },
    ],
    rows,
  });
  if (rows.length > 0) verdictFormatting(sheet, `G2:G${table.last}`);
  return { table, status: 7, lines };
}

// ---------------------------------------------------------------- Daylight

function writeDaylight(sheet: ExcelJS.Worksheet, spaces: SpaceResult[], formats: Formats): void {
  const withDaylight = spaces.filter(
    (space) =>
      !dec(space.daylight.windowArea).isZero() ||
      !dec(space.daylight.primarySidelitArea).isZero() ||
      !dec(space.daylight.toplitArea).isZero() ||
      space.daylight.zones.length > 0,
  );
  const yesNo = (value: boolean) => (value ? 'Required' : 'Not required');
  const rows: Cell[][] = withDaylight.map((space) => {
    const daylight = space.daylight;
    return [
      spaces.indexOf(space) + 1,
      levelWords(space.level),
      space.name,
      num(daylight.windowArea),
      num(daylight.primarySidelitArea),
      num(daylight.secondarySidelitArea),
      num(daylight.toplitArea),
      num(daylight.primarySidelitW),
      num(daylight.secondarySidelitW),
      num(daylight.toplitW),
      yesNo(daylight.sidelightingControlRequired),
      yesNo(daylight.secondarySidelightingControlRequired),
      yesNo(daylight.toplightingControlRequired),
      daylight.geometryEvaluated ? daylight.reasons.join(' ') : 'No room rectangle (length × width) is given, so no zones are drawn.',
      daylight.section,
    ];
  });
  writeTable(sheet, {
    name: 'DaylightZones',
    top: 1,
    freezeColumns: 3,
    empty: 'No space has windows or skylights.',
    columns: [
      { header: 'Space no.', width: 10 },
      { header: 'Level', width: 14 },
      { header: 'Space', width: 30 },
      { header: 'Window area', width: 12, numFmt: formats.area },
      { header: 'Primary sidelit area', width: 14, numFmt: formats.area },
      { header: 'Secondary sidelit area', width: 14, numFmt: formats.area },
      { header: 'Toplit area', width: 12, numFmt: formats.area },
      { header: 'Primary sidelit watts', width: 14, numFmt: formats.watts },
      { header: 'Secondary sidelit watts', width: 14, numFmt: formats.watts },
      { header: 'Toplit watts', width: 12, numFmt: formats.watts },
      { header: 'Sidelighting control', width: 16 },
      { header: 'Secondary sidelighting control', width: 16 },
      { header: 'Toplighting control', width: 16 },
      { header: 'Why', width: 60, wrap: true },
      { header: 'Section', width: 22 },
    ],
    rows,
  });
}

// ---------------------------------------------------------------- Exterior

interface ExteriorTable {
  table: WrittenTable;
  columns: { allowance: number; installed: number; exempt: number };
}

function writeExterior(sheet: ExcelJS.Worksheet, input: PackageInput, formats: Formats): ExteriorTable | null {
  const exterior = input.result.exterior;
  if (exterior === null) {
    sheet.getColumn(1).width = 60;
    sheet.getCell('A1').value = 'The project has no exterior lighting.';
    return null;
  }
  const rows: Cell[][] = exterior.applications.map((application, index) => {
    const row = 2 + index;
    const quantity = dec(application.quantity);
    const rate = factorFor(quantity, [dec(application.rate)], dec(application.allowanceW));
    return [
      application.label,
      application.tradable ? 'Tradable' : 'Nontradable',
      num(quantity),
      quantityUnit(application.unit),
      rate,
      formula(`C${row}*E${row}`, num(application.allowanceW)),
      num(application.installedW),
      num(application.exemptW),
      application.exemption ? application.exemption.label : '',
      num(application.baseSiteUsedW),
      formula(`F${row}+J${row}-G${row}`, num(application.marginW)),
      withinWords(application.withinAllowance),
      application.section,
    ];
  });
  const total = (pick: (application: ExteriorApplicationResult) => string) =>
    num(sum(exterior.applications.map((application) => dec(pick(application)))));
  const table = writeTable(sheet, {
    name: 'ExteriorApplications',
    top: 1,
    freezeColumns: 1,
    empty: 'No exterior applications are entered.',
    columns: [
      { header: 'Application', width: 36 },
      { header: 'Kind', width: 14 },
      { header: 'Quantity', width: 12, numFmt: formats.quantity },
      { header: 'Unit', width: 12 },
      { header: 'Allowance rate (W per unit)', width: 16, numFmt: formats.rate },
      { header: 'Allowance', width: 13, numFmt: formats.watts, total: total((application) => application.allowanceW) },
      { header: 'Installed counted', width: 14, numFmt: formats.watts, total: total((application) => application.installedW) },
      { header: 'Exempt', width: 12, numFmt: formats.watts, total: total((application) => application.exemptW) },
      { header: 'Why exempt', width: 30, wrap: true },
      { header: 'Base site allowance used', width: 16, numFmt: formats.watts },
      { header: 'Margin', width: 12, numFmt: formats.watts },
      { header: 'Status', width: 20 },
      { header: 'Section', width: 22 },
    ],
    rows,
  });
  if (rows.length > 0) verdictFormatting(sheet, `L2:L${table.last}`);
  const note = (table.totalsRow ?? table.first) + 2;
  sheet.getCell(note, 1).value =
    'Tradable applications are judged together with the base site allowance; each status says how its pool or the application itself stands.';
  return { table, columns: { allowance: 6, installed: 7, exempt: 8 } };
}

// ---------------------------------------------------------------- Sources

function writeSources(sheet: ExcelJS.Worksheet, input: PackageInput): void {
  const rows: Cell[][] = input.result.unverifiedValues.map((value) => [
    value.what,
    value.citation.short,
    value.source,
    confidenceWords(value),
    noteWords(value),
  ]);
  writeTable(sheet, {
    name: 'ValueSources',
    top: 1,
    freezeColumns: 1,
    empty: 'Every code value this evaluation used is checked against its published source.',
    columns: [
      { header: 'Value used', width: 44, wrap: true },
      { header: 'Cited as', width: 44, wrap: true },
      { header: 'Source', width: 40, wrap: true },
      { header: 'Confidence', width: 36, wrap: true },
      { header: 'Note', width: 70, wrap: true },
    ],
    rows,
  });
  const after = Math.max(rows.length, 1) + 3;
  sheet.getCell(after, 1).value = `Code tables: ${editionWords(input.result.edition)}, data version ${input.result.dataVersion}.`;
  sheet.getCell(after + 1, 1).value = 'The engineer of record verifies every value listed here before relying on the result.';
}

// ---------------------------------------------------------------- Summary

function writeSummary(
  sheet: ExcelJS.Worksheet,
  input: PackageInput,
  spaces: SpacesTable,
  controls: ControlsTable,
  exterior: ExteriorTable | null,
  formats: Formats,
): void {
  const { project, result, revision } = input;
  sheet.getColumn(1).width = 34;
  sheet.getColumn(2).width = 40;
  sheet.getColumn(3).width = 16;
  sheet.getColumn(4).width = 16;
  sheet.getColumn(5).width = 16;
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
  let row = 1;
  const title = sheet.getCell(row, 1);
  title.value = revision.draft ? `${project.name} — DRAFT — not for permit` : project.name;
  title.font = { bold: true, size: 14 };
  row += 2;

  const fact = (label: string, value: Cell, numFmt?: string) => {
    sheet.getCell(row, 1).value = label;
    const cell = sheet.getCell(row, 2);
    cell.value = value;
    if (numFmt) cell.numFmt = numFmt;
    row += 1;
    return `B${row - 1}`;
  };
  const heading = (text: string) => {
    row += 1;
    const cell = sheet.getCell(row, 1);
    cell.value = text;
    cell.font = { bold: true, size: 12 };
    row += 1;
  };

  fact('Project', project.name);
  fact('Address', project.address ?? 'Not entered');
  fact('Jurisdiction', project.jurisdiction ?? 'Not entered');
  fact('Code edition', editionWords(result.edition));
  fact('Method', methodWords(result.method));
  fact('Units', unitSystemWords(result.units));
  fact('Lighting zone', result.exterior?.lightingZone ?? (project.lightingZone === null ? 'Not entered' : String(project.lightingZone)));
  fact('Revision', revision.draft ? `${revision.number} (draft)` : String(revision.number));
  fact('Date', dateWords(revision.madeAt, project.timeZone));
  fact('Design state', stateWords(project.state));
  fact('Fingerprint', revision.fingerprint);

  const sumRange = (range: string | null) => (range === null ? '0' : `SUM(${range})`);

  heading('Interior lighting power');
  const counted = num(sum(result.interior.spaces.map((space) => (space.lighting === 'unlit' ? ZERO : dec(space.allowanceW)))));
  // The retail display fixed adder, used once per building, is the part of the total no space carries.
  const fixedW = dec(result.interior.allowanceW).minus(counted);
  const fixed = fixedW.abs().lessThanOrEqualTo('0.05') ? 0 : num(fixedW);
  const fixedCell = fact('Retail display adder used (once per building)', fixed, formats.watts);
  const allowanceCell = fact(
    'Allowance',
    formula(`${sumRange(spaces.table.range(spaces.columns.counted))}+${fixedCell}`, num(result.interior.allowanceW)),
    formats.watts,
  );
  const installedCell = fact(
    'Installed',
    formula(sumRange(spaces.table.range(spaces.columns.installed)), num(result.interior.installedW)),
    formats.watts,
  );
  fact('Exempt (not counted)', formula(sumRange(spaces.table.range(spaces.columns.exempt)), num(result.interior.exemptW)), formats.watts);
  const marginCell = fact('Margin', formula(`${allowanceCell}-${installedCell}`, num(result.interior.marginW)), formats.watts);
  fact(
    'Margin share',
    formula(
      `IF(${allowanceCell}>0,${marginCell}/${allowanceCell},"")`,
      result.interior.marginPct === null ? '' : num(dec(result.interior.marginPct).dividedBy(100)),
    ),
    formats.percent,
  );
  const interiorVerdict = fact(
    'Interior power',
    formula(`IF(${installedCell}<=${allowanceCell},"${withinWords(true)}","${withinWords(false)}")`, withinWords(result.interior.complies)),
  );
  const verdictCells = [interiorVerdict];

  if (result.exterior !== null && exterior !== null) {
    heading('Exterior lighting power');
    const base = fact('Base site allowance', num(result.exterior.baseSiteAllowanceW), formats.watts);
    const allowance = fact(
      'Allowance',
      formula(`${base}+${sumRange(exterior.table.range(exterior.columns.allowance))}`, num(result.exterior.allowanceW)),
      formats.watts,
    );
    const installed = fact(
      'Installed counted',
      formula(sumRange(exterior.table.range(exterior.columns.installed)), num(result.exterior.installedW)),
      formats.watts,
    );
    fact(
      'Exempt (not counted)',
      formula(sumRange(exterior.table.range(exterior.columns.exempt)), num(result.exterior.exemptW)),
      formats.watts,
    );
    fact(
      'Margin',
      formula(`${allowance}-${installed}`, num(dec(result.exterior.allowanceW).minus(result.exterior.installedW))),
      formats.watts,
    );
    verdictCells.push(fact('Exterior power', withinWords(result.exterior.complies)));
  }

  heading('Controls');
  const statusRange = controls.table.range(controls.status);
  const countOf = (status: ControlLine['status']) => {
    const words = controlStatusWords(status);
    const cached = controls.lines.filter((line) => line.status === status).length;
    return statusRange === null ? 0 : formula(`COUNTIF(${statusRange},"${words}")`, cached);
  };
  fact('Met', countOf('met'));
  fact('Exception claimed', countOf('exception-claimed'));
  fact('Not met', countOf('not-met'));
  fact('To verify', countOf('to-verify'));
  fact('Not required', countOf('not-required'));
  verdictCells.push(fact('Controls', result.controlsComply ? 'Met' : 'Not met'));

  heading('Result');
  verdictCells.push(fact('Overall', verdictWords(result.verdict)));
  fact('Spaces without luminaires', result.openItems.spacesWithoutLuminaires);
  fact('Control requirements to verify', result.openItems.controlsToVerify);
  for (const cell of verdictCells) verdictFormatting(sheet, `${cell}:${cell}`);

  // Subtotals by level: SUMIFS over the Spaces sheet.
  const levels = result.interior.levels;
  if (levels !== null && levels.length > 0 && spaces.table.range(1) !== null) {
    heading('By level');
    const levelRange = spaces.table.range(spaces.columns.level)!;
    const ordered = [...new Set(orderedSpaces(result).map((space) => space.level ?? ''))];
    const levelRows: Cell[][] = ordered.map((level, index) => {
      const line = levels.find((candidate) => candidate.level === level)!;
      const at = row + 1 + index;
      const sumif = (column: number) => `SUMIFS(${spaces.table.range(column)},${levelRange},A${at})`;
      return [
        levelWords(level === '' ? null : level),
        formula(sumif(spaces.columns.area), num(line.area)),
        formula(sumif(spaces.columns.counted), num(line.allowanceW)),
        formula(sumif(spaces.columns.installed), num(line.installedW)),
        formula(`C${at}-D${at}`, num(line.marginW)),
      ];
    });
    const top = row;
    const written = writeTable(sheet, {
      name: 'LevelSubtotals',
      top,
      empty: '',
      columns: [
        { header: 'Level', width: 34 },
        { header: 'Area', width: 40, numFmt: formats.area },
        { header: 'Allowance', width: 16, numFmt: formats.watts },
        { header: 'Installed', width: 16, numFmt: formats.watts },
        { header: 'Margin', width: 16, numFmt: formats.watts },
      ],
      rows: levelRows,
    });
    // writeTable freezes its header row; the summary keeps only its title row frozen.
    sheet.views = [{ state: 'frozen', ySplit: 1 }];
    row = written.last + 2;
  }

  row += 1;
  for (const caution of [...new Set(result.cautions)]) {
    const cell = sheet.getCell(row, 1);
    cell.value = caution;
    row += 1;
  }
}
