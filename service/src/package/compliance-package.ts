import {
  AlignmentType,
  BorderStyle,
  Document,
  Footer,
  Header,
  HeadingLevel,
  ImageRun,
  Packer,
  PageBreak,
  PageNumber,
  PageOrientation,
  Paragraph,
  ShadingType,
  Table,
  TableCell,
  TableLayoutType,
  TableRow,
  TextRun,
  WidthType,
  type FileChild,
} from 'docx';
import { Readable } from 'node:stream';
import JSZip from 'jszip';
import type { ControlLine, EvaluationResult, SpaceResult } from '../../../contract/result.js';
import { reviewItemKindLabels, reviewVerdictLabels, type ReviewItem, type ReviewOutcome } from '../../../contract/review.js';
import { dec, sum, ZERO } from '../compliance/numbers.js';
import type { ProvidedControl } from '../compliance/document.js';
import { maxPlanDrawings, planDrawing, type PlanDrawing } from './daylight-drawing.js';
import type { CompliancePackageOptions, PackageInput, PackageRevisionStamp } from './package-input.js';
import {
  basisWords,
  citedWords,
  confidenceWords,
  controlStatusWords,
  dateWords,
  editionWords,
  figures,
  levelWords,
  marginWords,
  methodWords,
  noteWords,
  orderedSpaces,
  providedWords,
  quantityUnit,
  requirementWords,
  spacesByLevel,
  spaceStatusWords,
  stateWords,
  unitSystemWords,
  unitWords,
  useWords,
  verdictWords,
  withinWords,
  withUnits,
  zoneWords,
} from './package-words.js';

/** The mark every page of a draft package carries in its header. */
export const draftMark = 'DRAFT — not for permit';

/**
 * The compliance package as a Word document: a cover, the summary, the interior table by level,
 * the luminaire schedule, the controls, the daylight zones, the exterior, the review record, the
 * values to verify, the cautions, the designer's statement and the revision history; the
 * fingerprint in the footer of every page, and the draft mark in the header of every page of a
 * draft. Our own layout and words.
 *
 * Pure: reads only its input (the date printed is the revision's), no network.
 */
export async function buildCompliancePackage(input: PackageInput, options: CompliancePackageOptions = {}): Promise<Buffer> {
  const drawings = await planDrawings(input);
  bodies = { viaDocx: options.tablesViaDocx === true, rows: [] };
  let document: Document;
  let rows: string[];
  try {
    document = packageDocument(input, options, drawings);
    rows = bodies.rows;
  } finally {
    bodies = null;
  }
  return withTableBodies(await Packer.toBuffer(document), rows);
}

/**
 * The plans of the daylit rooms, in the spaces' order, drawn as the Daylight page draws them: a
 * room with a rectangle (length × width) and at least one zone, at most {@link maxPlanDrawings}.
 */
async function planDrawings(input: PackageInput): Promise<Map<string, PlanDrawing>> {
  const { result, document } = input;
  const units = unitWords(result.units);
  const byId = new Map(document.spaces.map((space) => [space.id, space]));
  const drawn = orderedSpaces(result)
    .filter((space) => space.daylight.geometryEvaluated && space.daylight.zones.length > 0)
    .flatMap((space) => {
      const entry = byId.get(space.id);
      return entry?.length !== undefined && entry.width !== undefined ? [{ space, entry, length: entry.length, width: entry.width }] : [];
    })
    .slice(0, maxPlanDrawings);
  // One at a time: a handful of milliseconds each, and libvips holds one picture's pixels at once.
  const drawings = new Map<string, PlanDrawing>();
  for (const { space, entry, length, width } of drawn) {
    drawings.set(
      space.id,
      await planDrawing(
        { length: Number(length), width: Number(width), windows: entry.windows, skylights: entry.skylights, zones: space.daylight.zones },
        { length: withUnits.length(length, result.units), width: withUnits.length(width, result.units), unit: units.length },
      ),
    );
  }
  return drawings;
}

function packageDocument(input: PackageInput, options: CompliancePackageOptions, drawings: ReadonlyMap<string, PlanDrawing>): Document {
  const { project, revision } = input;
  const header = pageHeader(input);
  const headers = { default: header };
  const footers = { default: pageFooter(revision, portraitWidth) };
  const wideFooters = { default: pageFooter(revision, landscapeWidth) };
  const portrait = { page: { size: { width: 12240, height: 15840 }, margin: margins } };
  const landscape = { page: { size: { width: 12240, height: 15840, orientation: PageOrientation.LANDSCAPE }, margin: margins } };
  return new Document({
    creator: revision.madeBy,
    lastModifiedBy: revision.madeBy,
    title: `${project.name}: lighting compliance package, revision ${revision.number}`,
    description: `Fingerprint ${revision.fingerprint}`,
    styles: {
      default: { document: { run: { font: 'Calibri', size: 20 } } },
      paragraphStyles: [
        { id: 'Cell', name: 'Table text', run: { size: tableSize }, paragraph: { spacing: { before: 0, after: 0 } } },
        { id: 'CellRight', name: 'Table figure', basedOn: 'Cell', paragraph: { alignment: AlignmentType.RIGHT } },
      ],
    },
    sections: [
      {
        properties: portrait,
        headers,
        footers,
        children: [...cover(input), new Paragraph({ children: [new PageBreak()] }), ...summary(input)],
      },
      {
        properties: landscape,
        headers,
        footers: wideFooters,
        children: [
          ...spacesPart(input),
          ...luminairePart(input, options),
          ...controlsPart(input),
          ...daylightPart(input, drawings),
          ...exteriorPart(input),
        ],
      },
      {
        properties: portrait,
        headers,
        footers,
        children: [...reviewPart(input), ...unverifiedPart(input), ...cautionsPart(input), ...statementPart(input), ...historyPart(input)],
      },
    ],
  });
}

// ---------------------------------------------------------------- layout helpers

const margins = { top: 1080, bottom: 1080, left: 1080, right: 1080, header: 540, footer: 540 };
/** Text width in twips: letter paper less the margins. */
const portraitWidth = 12240 - 2160;
const landscapeWidth = 15840 - 2160;

const headerShade = 'D9EDEA';
const subtotalShade = 'EEF4F3';
const tableSize = 17;

function pageHeader(input: PackageInput): Header {
  const { project, revision } = input;
  const children: Paragraph[] = [];
  if (revision.draft) {
    children.push(
      new Paragraph({
        alignment: AlignmentType.CENTER,
        children: [new TextRun({ text: draftMark, bold: true, color: 'B3261E', size: 24 })],
      }),
    );
  }
  children.push(
    new Paragraph({
      alignment: AlignmentType.RIGHT,
      children: [
        new TextRun({ text: `${project.name} · Lighting compliance package · Revision ${revision.number}`, size: 16, color: '555555' }),
      ],
    }),
  );
  return new Header({ children });
}

function pageFooter(revision: PackageRevisionStamp, width: number): Footer {
  return new Footer({
    children: [
      new Paragraph({
        border: { top: { style: BorderStyle.SINGLE, size: 4, color: '999999', space: 4 } },
        children: [
          new TextRun({ text: 'Fingerprint ', size: 14, color: '555555' }),
          new TextRun({ text: revision.fingerprint, size: 14, font: 'Consolas' }),
          new TextRun({ text: '\tPage ', size: 14 }),
          new TextRun({ children: [PageNumber.CURRENT], size: 14 }),
          new TextRun({ text: ' of ', size: 14 }),
          new TextRun({ children: [PageNumber.TOTAL_PAGES], size: 14 }),
        ],
        tabStops: [{ type: 'right', position: width }],
      }),
    ],
  });
}

function heading(text: string, level: 1 | 2 | 3 = 1): Paragraph {
  const headingLevel = level === 1 ? HeadingLevel.HEADING_1 : level === 2 ? HeadingLevel.HEADING_2 : HeadingLevel.HEADING_3;
  return new Paragraph({ heading: headingLevel, keepNext: true, spacing: { before: level === 1 ? 240 : 160, after: 80 }, text });
}

function para(text: string, options: { bold?: boolean; italics?: boolean; size?: number; after?: number } = {}): Paragraph {
  return new Paragraph({
    spacing: { after: options.after ?? 80 },
    children: [new TextRun({ text, bold: options.bold, italics: options.italics, size: options.size })],
  });
}

function bullet(text: string): Paragraph {
  return new Paragraph({ bullet: { level: 0 }, spacing: { after: 40 }, children: [new TextRun(text)] });
}

interface CellOptions {
  bold?: boolean;
  right?: boolean;
  shade?: string;
}

type CellText = string | { text: string; options: CellOptions };

function strong(text: string): CellText {
  return { text, options: { bold: true } };
}

interface Column {
  header: string;
  /** Relative width. */
  weight: number;
  right?: boolean;
}

interface TableRowText {
  cells: CellText[];
  shade?: string;
  bold?: boolean;
}

/**
 * One table cell, kept light: the paragraph style carries the size and alignment, the table its
 * cell margins; only bold and shading are set per cell.
 */
function cellOf(content: CellText, base: CellOptions = {}): TableCell {
  const text = typeof content === 'string' ? content : content.text;
  const options = typeof content === 'string' ? base : { ...base, ...content.options };
  const style = options.right ? 'CellRight' : 'Cell';
  return new TableCell({
    ...(options.shade ? { shading: { type: ShadingType.CLEAR, color: 'auto', fill: options.shade } } : {}),
    children: text.split('\n').map(
      (line) =>
        new Paragraph({
          style,
          children: line === '' ? [] : [options.bold ? new TextRun({ text: line, bold: true }) : new TextRun(line)],
        }),
    ),
  });
}

/**
 * How a build writes its tables' rows below the header. A 5,000-space package has hundreds of
 * thousands of cells, and docx's objects for them cost tens of seconds and gigabytes; so the body
 * rows are written as WordprocessingML text, the very markup docx writes for the same cells (a
 * test compares the two), and put in place of a marker row once docx has packed the rest.
 * `viaDocx` builds them with docx's objects instead: the reference the test compares with.
 */
interface TableBodies {
  viaDocx: boolean;
  /** The body rows of each table as markup, by the number its marker row carries. */
  rows: string[];
}

/** The tables of the build in progress. Documents are put together synchronously, so one build fills it at a time. */
let bodies: TableBodies | null = null;

/** The marker row's paragraph style: a style name no text of a person can produce. */
const markerStyle = 'TableBodyRows';

/** A table with a header row that repeats on every page, figures aligned right. */
function table(columns: Column[], rows: TableRowText[], width: number): Table {
  const totalWeight = columns.reduce((total, column) => total + column.weight, 0);
  const columnWidths = columns.map((column) => Math.floor((width * column.weight) / totalWeight));
  const header = new TableRow({
    tableHeader: true,
    cantSplit: true,
    children: columns.map((column) => cellOf(column.header, { bold: true, shade: headerShade, right: column.right })),
  });
  if (bodies === null) throw new Error('table() is called only while a package is built');
  let body: TableRow[];
  if (bodies.viaDocx) {
    body = rows.map(
      (row) =>
        new TableRow({
          cantSplit: true,
          children: row.cells.map((content, index) => cellOf(content, { right: columns[index]?.right, shade: row.shade, bold: row.bold })),
        }),
    );
  } else {
    // docx widens the columns to the table's width, each cell's width rounded (Table.setCellWidths).
    const total = columnWidths.reduce((sum, columnWidth) => sum + columnWidth, 0);
    const scale = total > 0 && width > total ? width / total : 1;
    const cellWidths = columnWidths.map((columnWidth) => Math.round(columnWidth * scale));
    bodies.rows.push(rows.map((row) => rowMarkup(row, columns, cellWidths)).join(''));
    const marker = new TableRow({
      children: [new TableCell({ children: [new Paragraph({ style: `${markerStyle}${bodies.rows.length - 1}` })] })],
    });
    body = rows.length === 0 ? [] : [marker];
  }
  return new Table({
    width: { size: width, type: WidthType.DXA },
    columnWidths,
    layout: TableLayoutType.FIXED,
    margins: { top: 30, bottom: 30, left: 80, right: 80 },
    rows: [header, ...body],
  });
}

/** XML 1.0 has no place for these characters; docx would write them and break the file. */
// eslint-disable-next-line no-control-regex -- these very characters are what is matched
const notInXml = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

function escapeXml(text: string): string {
  return text
    .replace(notInXml, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

/** One body row as docx writes it: cantSplit, each cell's width and shading, a paragraph per line, bold runs marked. */
function rowMarkup(row: TableRowText, columns: Column[], cellWidths: number[]): string {
  let xml = '<w:tr><w:trPr><w:cantSplit/></w:trPr>';
  row.cells.forEach((content, index) => {
    const text = typeof content === 'string' ? content : content.text;
    const base: CellOptions = { right: columns[index]?.right, shade: row.shade, bold: row.bold };
    const options = typeof content === 'string' ? base : { ...base, ...content.options };
    const style = options.right ? 'CellRight' : 'Cell';
    const cellWidth = cellWidths[index];
    xml += '<w:tc><w:tcPr>';
    if (cellWidth !== undefined && cellWidth > 0) xml += `<w:tcW w:type="dxa" w:w="${cellWidth}"/>`;
    if (options.shade) xml += `<w:shd w:fill="${options.shade}" w:color="auto" w:val="clear"/>`;
    xml += '</w:tcPr>';
    for (const line of text.split('\n')) {
      xml += `<w:p><w:pPr><w:pStyle w:val="${style}"/></w:pPr>`;
      if (line !== '')
        xml += `<w:r>${options.bold ? '<w:rPr><w:b/><w:bCs/></w:rPr>' : ''}<w:t xml:space="preserve">${escapeXml(line)}</w:t></w:r>`;
      xml += '</w:p>';
    }
    xml += '</w:tc>';
  });
  return `${xml}</w:tr>`;
}

/** Puts each table's body rows in place of its marker row in the packed file. */
async function withTableBodies(packed: Buffer, rows: string[]): Promise<Buffer> {
  if (rows.length === 0) return packed;
  const zip = await JSZip.loadAsync(packed);
  const entry = zip.file('word/document.xml');
  if (entry === null) throw new Error('the packed document has no word/document.xml');
  const xml = await entry.async('string');
  const parts: string[] = [];
  let from = 0;
  rows.forEach((markup, index) => {
    if (markup === '') return;
    const at = xml.indexOf(`<w:pStyle w:val="${markerStyle}${index}"/>`, from);
    const start = at < 0 ? -1 : xml.lastIndexOf('<w:tr>', at);
    const end = at < 0 ? -1 : xml.indexOf('</w:tr>', at);
    if (start < from || end < 0) throw new Error(`the marker row of table ${index} is missing from the packed document`);
    parts.push(xml.slice(from, start), markup);
    from = end + '</w:tr>'.length;
  });
  parts.push(xml.slice(from));
  // Streamed into the zip a megabyte at a time: the whole document is never one string (on a large
  // project it is tens of megabytes, held twice over as text and as UTF-8).
  zip.file('word/document.xml', Readable.from(utf8Pieces(parts)));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 } });
}

/** The texts as UTF-8, in pieces of about a million characters, none cut inside a surrogate pair. */
export function* utf8Pieces(texts: readonly string[], size = 1 << 20): Generator<Buffer> {
  for (const text of texts) {
    let at = 0;
    while (at < text.length) {
      let end = Math.min(at + size, text.length);
      // A high surrogate at the cut stays with its low half: both go to the next piece, or to this
      // one when it is the piece's only character.
      const last = text.charCodeAt(end - 1);
      if (end < text.length && last >= 0xd800 && last <= 0xdbff) end += end - at > 1 ? -1 : 1;
      yield Buffer.from(text.slice(at, end), 'utf8');
      at = end;
    }
  }
}

/** A two-column table of labels and values. */
function facts(rows: [string, string][], width = portraitWidth): Table {
  return table(
    [
      { header: 'Item', weight: 2 },
      { header: 'Value', weight: 5 },
    ],
    rows.map(([label, value]) => ({ cells: [strong(label), value] })),
    width,
  );
}

function gap(): Paragraph {
  return new Paragraph({ spacing: { after: 120 }, children: [] });
}

// ---------------------------------------------------------------- cover

function preparedBy(input: PackageInput): string {
  const { project, revision } = input;
  const designer = [project.designerName, project.designerFirm].filter((part) => part !== null && part.trim() !== '').join(', ');
  const licence = project.designerLicence ? ` (licence ${project.designerLicence})` : '';
  return designer === '' ? revision.madeBy : `${designer}${licence}`;
}

function lightingZone(input: PackageInput): string {
  const zone = input.result.exterior?.lightingZone ?? (input.project.lightingZone === null ? null : String(input.project.lightingZone));
  return zone === null ? 'Not entered (no exterior lighting evaluated)' : `Zone ${zone}`;
}

function cover(input: PackageInput): FileChild[] {
  const { project, result, revision } = input;
  const edition =
    result.amendments.length === 0
      ? editionWords(result.edition)
      : `${editionWords(result.edition)}, with ${result.amendments.map((amendment) => amendment.title).join('; ')}`;
  const children: FileChild[] = [
    new Paragraph({
      spacing: { before: 1200, after: 120 },
      children: [new TextRun({ text: 'Lighting energy compliance package', size: 28, color: '00696B' })],
    }),
    new Paragraph({ spacing: { after: 480 }, children: [new TextRun({ text: project.name, bold: true, size: 44 })] }),
    facts([
      ['Project', project.name],
      ['Address', project.address ?? 'Not entered'],
      ['Jurisdiction', project.jurisdiction ?? 'Not entered'],
      ['Permit number', project.permitNumber ?? 'Not entered'],
      ['Code edition', edition],
      ['Compliance method', methodWords(result.method)],
      ['Units', unitSystemWords(result.units)],
      ['Lighting zone', lightingZone(input)],
      ['Prepared by', preparedBy(input)],
      ['Revision', revision.draft ? `${revision.number} (draft)` : String(revision.number)],
      ['Date', dateWords(revision.madeAt, project.timeZone)],
      ['Design state', stateWords(project.state)],
      ['Code tables', `Data version ${result.dataVersion}`],
      ['Fingerprint', revision.fingerprint],
    ]),
    gap(),
  ];
  if (revision.draft) {
    children.push(para(`${draftMark}. This package was made before the design was accepted; it is for coordination only.`, { bold: true }));
  }
  children.push(
    para(
      'The fingerprint printed on every page identifies the evaluation this package reports. A printed copy can be checked against it.',
      { italics: true, size: 18 },
    ),
  );
  return children;
}

// ---------------------------------------------------------------- summary

function summary(input: PackageInput): FileChild[] {
  const { result } = input;
  const interior = result.interior;
  const children: FileChild[] = [heading('Summary'), para(`Overall result: ${verdictWords(result.verdict)}`, { bold: true, size: 24 })];
  if (result.verdict === 'incomplete') {
    const open: string[] = [];
    if (result.openItems.spacesWithoutLuminaires > 0)
      open.push(`${result.openItems.spacesWithoutLuminaires} space(s) have no luminaires entered`);
    if (result.openItems.controlsToVerify > 0) open.push(`${result.openItems.controlsToVerify} control requirement(s) are to verify`);
    children.push(para(`Open items: ${open.join('; ')}.`));
  }
  children.push(
    heading('Interior lighting power', 2),
    facts([
      ['Lighted floor area', withUnits.area(interior.area, result.units)],
      ['Allowance', withUnits.watts(interior.allowanceW)],
      ['Installed (counted)', withUnits.watts(interior.installedW)],
      ['Exempt (not counted)', withUnits.watts(interior.exemptW)],
      ['Margin', marginWords(interior.marginW, interior.marginPct)],
      ['Result', withinWords(interior.complies)],
      ['Section', interior.section],
    ]),
  );
  if (interior.additional !== null) {
    children.push(
      para(
        `Additional allowances claimed: ${withUnits.watts(interior.additional.claimedW)}; used by the lighting they are for: ${withUnits.watts(interior.additional.usableW)}.`,
      ),
    );
  }
  children.push(heading('Exterior lighting power', 2));
  if (result.exterior === null) {
    children.push(para('The project has no exterior lighting.'));
  } else {
    const exterior = result.exterior;
    const margin = dec(exterior.allowanceW).minus(exterior.installedW).toString();
    children.push(
      facts([
        ['Lighting zone', `Zone ${exterior.lightingZone}`],
        ['Base site allowance', withUnits.watts(exterior.baseSiteAllowanceW)],
        ['Allowance (with the base site allowance)', withUnits.watts(exterior.allowanceW)],
        ['Installed (counted)', withUnits.watts(exterior.installedW)],
        ['Exempt (not counted)', withUnits.watts(exterior.exemptW)],
        ['Margin', marginWords(margin)],
        [
          'Tradable applications',
          `${withUnits.watts(exterior.tradable.installedW)} installed against ${withUnits.watts(exterior.tradable.allowanceW)}: ${withinWords(exterior.tradable.complies).toLowerCase()}`,
        ],
        ['Result', withinWords(exterior.complies)],
        ['Section', exterior.section],
      ]),
    );
  }
  const lines = allControlLines(result);
  const count = (status: ControlLine['status']) => String(lines.filter((line) => line.status === status).length);
  children.push(
    heading('Lighting controls', 2),
    facts([
      ['Met', count('met')],
      ['Exception claimed', count('exception-claimed')],
      ['Not met', count('not-met')],
      ['To verify', count('to-verify')],
      ['Not required', count('not-required')],
      ['Result', result.controlsComply ? 'Every requirement decided is met' : 'At least one requirement is not met'],
    ]),
    heading('Cautions', 2),
    ...cautions(result).map(bullet),
  );
  return children;
}

function allControlLines(result: EvaluationResult): ControlLine[] {
  return [
    ...result.interior.spaces.flatMap((space) => space.controls),
    ...(result.exterior?.applications.flatMap((application) => application.controls) ?? []),
  ];
}

function cautions(result: EvaluationResult): string[] {
  return [...new Set(result.cautions)];
}

// ---------------------------------------------------------------- interior by space

function spacesPart(input: PackageInput): FileChild[] {
  const { result } = input;
  const units = unitWords(result.units);
  const columns: Column[] = [
    { header: 'Space', weight: 4 },
    { header: 'LPD basis', weight: 4 },
    { header: `Area (${units.area})`, weight: 2, right: true },
    { header: `Allowed LPD (${units.density})`, weight: 2, right: true },
    { header: 'Allowance (W)', weight: 2, right: true },
    { header: 'Installed (W)', weight: 2, right: true },
    { header: 'Exempt (W)', weight: 2, right: true },
    { header: 'Margin (W)', weight: 2, right: true },
    { header: 'Status', weight: 3 },
  ];
  const rows: TableRowText[] = [];
  const groups = spacesByLevel(result);
  for (const group of groups) {
    if (groups.length > 1 || group.level !== null)
      rows.push({ cells: [strong(levelWords(group.level)), '', '', '', '', '', '', '', ''], shade: subtotalShade });
    for (const space of group.spaces) rows.push({ cells: spaceCells(space, result) });
    const counted = group.spaces.map((space) => (space.lighting === 'unlit' ? ZERO : dec(space.allowanceW)));
    const allowance = sum(counted);
    const installed = sum(group.spaces.map((space) => dec(space.installedW)));
    const line = result.interior.levels?.find((candidate) => candidate.level === (group.level ?? ''));
    rows.push({
      bold: true,
      cells: [
        `Subtotal, ${levelWords(group.level)}`,
        '',
        figures.area(line?.area ?? sum(group.spaces.map((space) => dec(space.area))).toString(), result.units),
        '',
        figures.watts(line?.allowanceW ?? allowance.toString()),
        figures.watts(line?.installedW ?? installed.toString()),
        figures.watts(sum(group.spaces.map((space) => dec(space.exemptW))).toString()),
        figures.watts(line?.marginW ?? allowance.minus(installed).toString()),
        '',
      ],
    });
  }
  const interior = result.interior;
  rows.push({
    bold: true,
    shade: subtotalShade,
    cells: [
      'Building total',
      '',
      figures.area(interior.area, result.units),
      '',
      figures.watts(interior.allowanceW),
      figures.watts(interior.installedW),
      figures.watts(interior.exemptW),
      figures.watts(interior.marginW),
      withinWords(interior.complies),
    ],
  });
  const children: FileChild[] = [heading('Interior lighting power by space'), table(columns, rows, landscapeWidth)];
  const fixed = dec(interior.allowanceW).minus(
    sum(interior.spaces.map((space) => (space.lighting === 'unlit' ? ZERO : dec(space.allowanceW)))),
  );
  if (fixed.greaterThan('0.05')) {
    children.push(
      para(`The building total includes ${withUnits.watts(fixed.toString())} of the retail display adder, granted once per building.`),
    );
  }
  if (interior.spaces.some((space) => space.lighting === 'unlit')) {
    children.push(para('A space confirmed unlit has no lighted floor area: its allowance is shown but not counted in the subtotals.'));
  }
  if (interior.spaces.some((space) => space.roomGeometryIncreaseApplied)) {
    children.push(para('Spaces marked “room-geometry increase” have the allowed LPD raised for their room cavity ratio.'));
  }
  return children;
}

function spaceCells(space: SpaceResult, result: EvaluationResult): CellText[] {
  const basis = space.roomGeometryIncreaseApplied ? `${space.lpdBasis.label} (room-geometry increase)` : space.lpdBasis.label;
  return [
    space.name,
    basis,
    figures.area(space.area, result.units),
    figures.density(space.allowedLpd),
    figures.watts(space.allowanceW),
    figures.watts(space.installedW),
    figures.watts(space.exemptW),
    space.lighting === 'entered' ? figures.watts(space.marginW) : '—',
    spaceStatusWords(space),
  ];
}

// ---------------------------------------------------------------- luminaires

function luminairePart(input: PackageInput, options: CompliancePackageOptions): FileChild[] {
  const types = [...input.document.luminaireTypes].sort((a, b) => a.tag.localeCompare(b.tag, 'en-US', { numeric: true }));
  const lines = input.result.interior.spaces.flatMap((space) => space.luminaires);
  const columns: Column[] = [
    { header: 'Type', weight: 1 },
    { header: 'Description', weight: 5 },
    { header: 'Rated input (W)', weight: 2, right: true },
    { header: 'Wattage basis', weight: 3 },
    { header: 'Use', weight: 2 },
    { header: 'Count', weight: 1, right: true },
    { header: 'Why exempt', weight: 3 },
    { header: 'Cut sheet', weight: 2 },
  ];
  const rows = types.map((type) => ({
    cells: [
      strong(type.tag),
      type.description === '' ? '—' : type.description,
      figures.rated(type.inputWatts),
      basisWords(type.basis),
      useWords(type.use),
      figures.quantity(sum(lines.filter((line) => line.tag === type.tag).map((line) => dec(line.count))).toString()),
      type.use === 'exempt' ? (type.exemptReason ?? 'No reason given') : '—',
      options.cutSheets?.get(type.tag) ?? 'None on file',
    ] as CellText[],
  }));
  return [
    heading('Luminaire schedule'),
    types.length === 0 ? para('No luminaire types are entered.') : table(columns, rows, landscapeWidth),
  ];
}

// ---------------------------------------------------------------- controls

function controlsPart(input: PackageInput): FileChild[] {
  const documentSpaces = new Map(input.document.spaces.map((space) => [space.id, space]));
  const columns: Column[] = [
    { header: 'Space', weight: 3 },
    { header: 'Requirement', weight: 4 },
    { header: 'Provided', weight: 5 },
    { header: 'Status', weight: 6 },
    { header: 'Section', weight: 2 },
  ];
  const rows: TableRowText[] = [];
  const lineRow = (name: string, first: boolean, line: ControlLine, provided: ProvidedControl[]) => ({
    cells: [
      first ? strong(name) : '',
      `${line.label} (${requirementWords(line.requirement).toLowerCase()})`,
      providedWords(provided.find((control) => control.strategy === line.strategy)),
      statusCell(line),
      line.section,
    ],
  });
  for (const group of spacesByLevel(input.result)) {
    rows.push({ cells: [strong(levelWords(group.level)), '', '', '', ''], shade: subtotalShade });
    for (const space of group.spaces) {
      const provided = documentSpaces.get(space.id)?.controls ?? [];
      space.controls.forEach((line, index) => rows.push(lineRow(space.name, index === 0, line, provided)));
      if (space.controls.length === 0) rows.push({ cells: [strong(space.name), 'None applies', '', '', ''] });
    }
  }
  const entries = new Map(input.document.exterior?.applications.map((entry) => [entry.key, entry]) ?? []);
  const exterior = input.result.exterior?.applications.filter((application) => application.controls.length > 0) ?? [];
  if (exterior.length > 0) {
    rows.push({ cells: [strong('Exterior'), '', '', '', ''], shade: subtotalShade });
    for (const application of exterior) {
      const provided = entries.get(application.key)?.controls ?? [];
      application.controls.forEach((line, index) => rows.push(lineRow(application.label, index === 0, line, provided)));
    }
  }
  return [
    heading('Lighting controls by space'),
    para('A requirement met says so; any other status gives the reason.', { size: 18 }),
    table(columns, rows, landscapeWidth),
  ];
}

/** The status in words, with the reason where it is anything but met. */
function statusCell(line: ControlLine): CellText {
  const words = controlStatusWords(line.status);
  return line.status === 'met' ? strong(words) : `${words}: ${line.reason}`;
}

// ---------------------------------------------------------------- daylight

function daylightPart(input: PackageInput, drawings: ReadonlyMap<string, PlanDrawing>): FileChild[] {
  const { result } = input;
  const units = unitWords(result.units);
  const spaces = orderedSpaces(result).filter((space) => !dec(space.daylight.windowArea).isZero() || space.daylight.zones.length > 0);
  const children: FileChild[] = [heading('Daylight zones')];
  if (spaces.length === 0) {
    children.push(para('No space has windows or skylights, so no daylight zones apply.'));
    return children;
  }
  const required = (value: boolean) => (value ? 'Required' : 'Not required');
  children.push(
    table(
      [
        { header: 'Space', weight: 4 },
        { header: `Window area (${units.area})`, weight: 2, right: true },
        { header: `Primary sidelit (${units.area})`, weight: 2, right: true },
        { header: 'Primary sidelit (W)', weight: 2, right: true },
        { header: `Secondary sidelit (${units.area})`, weight: 2, right: true },
        { header: 'Secondary sidelit (W)', weight: 2, right: true },
        { header: `Toplit (${units.area})`, weight: 2, right: true },
        { header: 'Toplit (W)', weight: 2, right: true },
        { header: 'Daylight controls', weight: 4 },
      ],
      spaces.map((space) => {
        const daylight = space.daylight;
        return {
          cells: [
            strong(space.name),
            figures.area(daylight.windowArea, result.units),
            figures.area(daylight.primarySidelitArea, result.units),
            figures.watts(daylight.primarySidelitW),
            figures.area(daylight.secondarySidelitArea, result.units),
            figures.watts(daylight.secondarySidelitW),
            figures.area(daylight.toplitArea, result.units),
            figures.watts(daylight.toplitW),
            [
              `Sidelighting: ${required(daylight.sidelightingControlRequired).toLowerCase()}`,
              `Secondary sidelighting: ${required(daylight.secondarySidelightingControlRequired).toLowerCase()}`,
              `Toplighting: ${required(daylight.toplightingControlRequired).toLowerCase()}`,
            ].join('\n'),
          ],
        };
      }),
      landscapeWidth,
    ),
  );
  const zoned = spaces.filter((space) => space.daylight.zones.length > 0);
  if (zoned.length > 0) {
    children.push(
      heading('Zone outlines on the plan', 2),
      para(
        `Each zone is a rectangle on the room’s plan, measured in ${units.length} from the room’s south-west corner (x along the north and south walls, y along the east and west walls); where zones overlap, toplit counts before primary and primary before secondary.`,
      ),
      table(
        [
          { header: 'Space', weight: 4 },
          { header: 'Zone', weight: 3 },
          { header: 'From', weight: 4 },
          { header: `x (${units.length})`, weight: 2, right: true },
          { header: `y (${units.length})`, weight: 2, right: true },
          { header: `Length (${units.length})`, weight: 2, right: true },
          { header: `Width (${units.length})`, weight: 2, right: true },
        ],
        zoned.flatMap((space) =>
          space.daylight.zones.map((zone, index) => ({
            cells: [
              index === 0 ? strong(space.name) : '',
              zoneWords(zone.kind),
              zone.source,
              figures.length(zone.x),
              figures.length(zone.y),
              figures.length(zone.length),
              figures.length(zone.width),
            ] as CellText[],
          })),
        ),
        landscapeWidth,
      ),
    );
  }
  if (drawings.size > 0) {
    children.push(
      heading('Plans of the daylit rooms', 2),
      para(
        'Each room to scale, north up, as the Daylight page draws it: windows in blue on their walls, skylights crossed, the zones hatched (P primary sidelit, S secondary sidelit, T toplit).',
      ),
    );
    for (const space of zoned) {
      const drawing = drawings.get(space.id);
      if (!drawing) continue;
      // About 6.5 in wide on the page, whatever the pixels.
      const shown = { width: 624, height: Math.round((624 * drawing.height) / drawing.width) };
      children.push(
        new Paragraph({ keepNext: true, spacing: { before: 120, after: 40 }, children: [new TextRun({ text: space.name, bold: true })] }),
        new Paragraph({
          children: [
            new ImageRun({
              type: 'png',
              data: drawing.png,
              transformation: shown,
              altText: {
                name: `Plan of ${space.name}`,
                title: `Daylight zones of ${space.name}`,
                description: `The daylight zones of ${space.name} on its plan.`,
              },
            }),
          ],
        }),
      );
    }
    const undrawn = zoned.filter((space) => space.daylight.geometryEvaluated && !drawings.has(space.id)).length;
    if (undrawn > 0) {
      children.push(
        para(
          `The package draws the plans of the first ${maxPlanDrawings} daylit rooms; the other ${undrawn} are given by their zone outlines above and drawn on the Daylight page.`,
        ),
      );
    }
  }
  const unevaluated = spaces.filter((space) => !space.daylight.geometryEvaluated);
  if (unevaluated.length > 0) {
    children.push(
      para(
        `No room rectangle (length × width) is given for ${unevaluated.map((space) => `“${space.name}”`).join(', ')}, so its zones are not drawn; the zone areas are to verify.`,
      ),
    );
  }
  return children;
}

// ---------------------------------------------------------------- exterior

function exteriorPart(input: PackageInput): FileChild[] {
  const exterior = input.result.exterior;
  const children: FileChild[] = [heading('Exterior lighting applications')];
  if (exterior === null) {
    children.push(para('The project has no exterior lighting.'));
    return children;
  }
  const rows: TableRowText[] = exterior.applications.map((application) => ({
    cells: [
      strong(application.label),
      application.tradable ? 'Tradable' : 'Nontradable',
      `${figures.quantity(application.quantity)} ${quantityUnit(application.unit)}`,
      `${figures.rate(application.rate)} ${application.unit}`,
      figures.watts(application.allowanceW),
      figures.watts(application.installedW),
      application.exemption ? `${figures.watts(application.exemptW)}: ${application.exemption.label}` : '—',
      figures.watts(application.marginW),
      withinWords(application.withinAllowance),
    ],
  }));
  rows.push({
    cells: ['Base site allowance', 'Tradable', '', '', figures.watts(exterior.baseSiteAllowanceW), '', '', '', ''],
  });
  rows.push({
    bold: true,
    shade: subtotalShade,
    cells: [
      'Site total',
      '',
      '',
      '',
      figures.watts(exterior.allowanceW),
      figures.watts(exterior.installedW),
      figures.watts(exterior.exemptW),
      figures.watts(dec(exterior.allowanceW).minus(exterior.installedW).toString()),
      withinWords(exterior.complies),
    ],
  });
  children.push(
    para(`Lighting zone ${exterior.lightingZone}; ${exterior.section}.`),
    table(
      [
        { header: 'Application', weight: 4 },
        { header: 'Kind', weight: 2 },
        { header: 'Quantity', weight: 2, right: true },
        { header: 'Allowance rate', weight: 2, right: true },
        { header: 'Allowance (W)', weight: 2, right: true },
        { header: 'Installed (W)', weight: 2, right: true },
        { header: 'Exempt (W)', weight: 3 },
        { header: 'Margin (W)', weight: 2, right: true },
        { header: 'Status', weight: 2 },
      ],
      rows,
      landscapeWidth,
    ),
    para(
      `Tradable applications are pooled: ${withUnits.watts(exterior.tradable.installedW)} installed against ${withUnits.watts(exterior.tradable.allowanceW)}, with ${withUnits.watts(exterior.tradable.baseSiteUsedW)} of the base site allowance used. Each nontradable application stands on its own allowance${exterior.baseSiteCoversNontradable ? ', and the base site allowance that is left may cover its excess' : ''}.`,
    ),
  );
  return children;
}

// ---------------------------------------------------------------- review record

const outcomeNames: Record<ReviewOutcome, string> = {
  met: 'Met',
  'not-met': 'Not met',
  'to-verify': 'To verify',
  'not-required': 'Not required',
};

const roleNames = { engineer: 'Engineer', reviewer: 'Reviewer', contractor: 'Contractor', admin: 'Administrator' } as const;

function reviewPart(input: PackageInput): FileChild[] {
  const review = input.review;
  if (review === undefined) return [];
  const children: FileChild[] = [heading(`Review record, round ${review.round}`)];
  if (review.items.length === 0) {
    children.push(para('The round has no check items.'));
    return children;
  }
  for (const item of review.items) children.push(...reviewItem(item, input.project.timeZone));
  return children;
}

function reviewItem(item: ReviewItem, timeZone: string | null): FileChild[] {
  const verdict = item.verdict === null ? 'No verdict recorded' : reviewVerdictLabels[item.verdict];
  const children: FileChild[] = [
    heading(item.title, 3),
    para(
      `${reviewItemKindLabels[item.kind]} · ${item.section} · The evaluation: ${outcomeNames[item.outcome]} · Reviewer’s verdict: ${verdict}${item.changed ? ' · Changed since the previous round' : ''}`,
      { size: 18 },
    ),
    para(item.reasoning, { size: 18 }),
  ];
  if (item.values.length > 0) children.push(para(item.values.map((value) => `${value.label}: ${value.value}`).join(' · '), { size: 18 }));
  for (const entry of item.thread) {
    const mark = entry.verdict ? ` (${reviewVerdictLabels[entry.verdict]})` : '';
    children.push(
      new Paragraph({
        indent: { left: 360 },
        spacing: { after: 40 },
        children: [
          new TextRun({
            text: `${entry.by}, ${roleNames[entry.role]}, ${dateWords(entry.at, timeZone)}, round ${entry.round}${mark}: `,
            bold: true,
            size: 18,
          }),
          new TextRun({ text: entry.text, size: 18 }),
        ],
      }),
    );
  }
  return children;
}

// ---------------------------------------------------------------- unverified values, cautions, statement, history

function unverifiedPart(input: PackageInput): FileChild[] {
  const values = input.result.unverifiedValues;
  const children: FileChild[] = [heading('Values to verify')];
  if (values.length === 0) {
    children.push(para('Every code value this evaluation used is checked against its published source.'));
    return children;
  }
  children.push(
    para(
      `The evaluation used ${values.length} value(s) not yet checked against a published source. The engineer of record verifies each against the adopted code before relying on this package.`,
    ),
    table(
      [
        { header: 'Value used', weight: 4 },
        { header: 'Cited as', weight: 4 },
        { header: 'Confidence', weight: 3 },
        { header: 'Note', weight: 5 },
      ],
      values.map((value) => ({
        cells: [value.what, citedWords(value), confidenceWords(value), noteWords(value)] as CellText[],
      })),
      portraitWidth,
    ),
  );
  return children;
}

function cautionsPart(input: PackageInput): FileChild[] {
  return [heading('Cautions'), ...cautions(input.result).map(bullet)];
}

function statementPart(input: PackageInput): FileChild[] {
  const { project, result } = input;
  const line = '______________________________';
  return [
    heading('Statement of the designer of record'),
    para(
      `I have reviewed the lighting design described in this package against ${editionWords(result.edition)} by the ${methodWords(result.method).toLowerCase()}. To the best of my knowledge the figures reported here describe the design as it will be installed, and I have verified the values listed under “Values to verify” against the code adopted by the authority having jurisdiction.`,
    ),
    gap(),
    facts([
      ['Designer of record', project.designerName ?? line],
      ['Firm', project.designerFirm ?? line],
      ['Licence', project.designerLicence ?? line],
      ['Signature', line],
      ['Date', line],
    ]),
  ];
}

function historyPart(input: PackageInput): FileChild[] {
  const revisions = [...input.history, input.revision];
  return [
    heading('Revision history'),
    table(
      [
        { header: 'Revision', weight: 1 },
        { header: 'Date', weight: 2 },
        { header: 'Made by', weight: 2 },
        { header: 'Kind', weight: 1 },
        { header: 'Fingerprint', weight: 5 },
      ],
      revisions.map((revision) => ({
        cells: [
          String(revision.number),
          dateWords(revision.madeAt, input.project.timeZone),
          revision.madeBy,
          revision.draft ? 'Draft' : 'For permit',
          revision.fingerprint,
        ] as CellText[],
        bold: revision === input.revision,
      })),
      portraitWidth,
    ),
  ];
}
