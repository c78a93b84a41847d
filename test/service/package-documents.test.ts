import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EvaluationResult } from '../../contract/result.js';
import type { ReviewItem } from '../../contract/review.js';
import { loadEditionData } from '../../service/src/code-tables/code-tables.repository.js';
import { evaluate, validateDocument, type EditionData } from '../../service/src/compliance/index.js';
import type { EvaluationDocument } from '../../service/src/compliance/document.js';
import { projectDocument } from '../../service/src/design/project-document.js';
import { buildCompliancePackage, draftMark, utf8Pieces } from '../../service/src/package/compliance-package.js';
import { buildComplianceWorkbook } from '../../service/src/package/compliance-workbook.js';
import type { PackageInput } from '../../service/src/package/package-input.js';
import { orderedSpaces, withUnits } from '../../service/src/package/package-words.js';
import { getProjectDetail } from '../../service/src/projects/projects.repository.js';
import { demoProjectName } from '../../schema/seeds/demo-data.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { recomputeWorkbook, type RecomputedCell } from '../support/workbook-formulas.js';
import { wordText } from '../support/xml-text.js';

let database: TestDatabase;
let input: PackageInput;
let tables: EditionData;

const fingerprint = createHash('sha256').update('package documents test').digest('hex');
const earlier = createHash('sha256').update('an earlier revision').digest('hex');

const reviewItem: ReviewItem = {
  id: 'item-1',
  kind: 'occupancy-sensing',
  title: '104 Staff workroom: Occupancy sensing',
  section: 'IECC 2021 §C405.2.1',
  outcome: 'met',
  reasoning: 'An occupant sensor is provided with a 20-minute time-out.',
  values: [{ label: 'Time-out', value: '20 min' }],
  verdict: 'needs-revision',
  changed: false,
  round: 1,
  thread: [
    {
      by: 'Riley Reviewer',
      role: 'reviewer',
      at: '2025-03-10T16:00:00Z',
      text: 'Show the sensor on the plan.',
      verdict: 'needs-revision',
      round: 1,
    },
    { by: 'Dana Engineer', role: 'engineer', at: '2025-03-11T09:30:00Z', text: 'Added to sheet E-201.', round: 1 },
  ],
};

beforeAll(async () => {
  database = await freshDatabase();
  const row = await database.db('projects').where({ name: demoProjectName }).first<{ id: string }>('id');
  const project = await getProjectDetail(database.db, row!.id, 'engineer');
  const raw = await projectDocument(database.db, row!.id);
  tables = (await loadEditionData(database.db, raw.edition))!;
  const outcome = validateDocument(raw, tables);
  if (!outcome.valid) throw new Error(JSON.stringify(outcome.problems));
  input = {
    project,
    document: outcome.document,
    result: evaluate(outcome.document, tables),
    revision: { number: 2, fingerprint, madeAt: '2025-03-14T15:00:00Z', madeBy: 'Dana Engineer', draft: true },
    history: [{ number: 1, fingerprint: earlier, madeAt: '2025-03-01T15:00:00Z', madeBy: 'Dana Engineer', draft: true }],
    review: { round: 1, items: [reviewItem] },
  };
});

afterAll(async () => {
  await database.drop();
});

// ---------------------------------------------------------------- reading a .docx back

interface WordParts {
  body: string;
  /** Each section's default header and footer, as text. */
  sections: { header: string; footer: string }[];
}

async function readWord(buffer: Buffer): Promise<WordParts> {
  const zip = await JSZip.loadAsync(buffer);
  const documentXml = await zip.file('word/document.xml')!.async('string');
  const relations = await zip.file('word/_rels/document.xml.rels')!.async('string');
  const targets = new Map(
    [...relations.matchAll(/<Relationship [^>]*Id="([^"]+)"[^>]*Target="([^"]+)"/g)].map((match) => [match[1]!, match[2]!]),
  );
  const part = async (id: string | undefined) =>
    id === undefined ? '' : wordText(await zip.file(`word/${targets.get(id)}`)!.async('string'));
  const sections: WordParts['sections'] = [];
  for (const sectPr of documentXml.match(/<w:sectPr[\s\S]*?<\/w:sectPr>/g) ?? []) {
    const header = /<w:headerReference w:type="default" r:id="([^"]+)"/.exec(sectPr)?.[1];
    const footer = /<w:footerReference w:type="default" r:id="([^"]+)"/.exec(sectPr)?.[1];
    sections.push({ header: await part(header), footer: await part(footer) });
  }
  return { body: wordText(documentXml), sections };
}

// ---------------------------------------------------------------- reading a .xlsx back

async function readWorkbook(buffer: Buffer): Promise<ExcelJS.Workbook> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(buffer as unknown as ArrayBuffer);
  return workbook;
}

function formulaOf(cell: ExcelJS.Cell): string {
  const value = cell.value as ExcelJS.CellFormulaValue;
  expect(value, `${cell.address} holds a formula`).toHaveProperty('formula');
  return value.formula;
}

function cached(cell: ExcelJS.Cell): number {
  const value = cell.value as ExcelJS.CellFormulaValue;
  return Number(value.result);
}

/** The value cell (column B) of the first row labelled `label` at or after the row labelled `after`. */
function summaryCell(sheet: ExcelJS.Worksheet, after: string, label: string): ExcelJS.Cell {
  let seen = false;
  for (let row = 1; row <= sheet.rowCount; row++) {
    const text = sheet.getCell(row, 1).value;
    if (text === after) seen = true;
    if (seen && text === label) return sheet.getCell(row, 2);
  }
  throw new Error(`no “${label}” after “${after}” on the summary`);
}

function recomputedIn(cells: RecomputedCell[]): (sheet: string, address: string) => number {
  const byAddress = new Map(cells.map((cell) => [`${cell.sheet}!${cell.address}`, cell.recomputed]));
  return (sheet, address) => {
    const value = byAddress.get(`${sheet}!${address}`);
    if (typeof value !== 'number') throw new Error(`${sheet}!${address} recomputes to no number: ${String(value)}`);
    return value;
  };
}

/**
 * How far a recomputed figure may lie from the one cached: half a unit in the cached figure's last
 * decimal, as the engine rounds what it reports, and never more than half its 0.1 W.
 */
function cachedRounding(cached: number): number {
  const decimals = Math.max(1, String(cached).split('.')[1]?.length ?? 0);
  return 0.5 * 10 ** -decimals + 1e-9;
}

/** The Summary's exterior allowance cell. */
function exteriorTotal(sheet: ExcelJS.Worksheet): string {
  return summaryCell(sheet, 'Exterior lighting power', 'Allowance').address;
}

/**
 * Each part of a .xlsx by name, with every shared-string reference in the sheets replaced by its
 * text and the shared strings as a sorted list: two files whose strings sit in another order in
 * the shared strings read back the same.
 */
async function partsWithStrings(buffer: Buffer): Promise<Map<string, string>> {
  const zip = await JSZip.loadAsync(buffer);
  const sst = await zip.file('xl/sharedStrings.xml')!.async('string');
  const strings = [...sst.matchAll(/<si>([\s\S]*?)<\/si>/g)].map((match) => match[1]!);
  const parts = new Map<string, string>();
  for (const [name, entry] of Object.entries(zip.files)) {
    if (entry.dir) continue;
    const xml = await entry.async('string');
    if (name === 'xl/sharedStrings.xml') {
      parts.set(name, `${/<sst [^>]*>/.exec(xml)![0]} ${[...strings].sort().join('\n')}`);
    } else if (name.startsWith('xl/worksheets/sheet')) {
      parts.set(
        name,
        xml.replace(/ t="s"><v>(\d+)<\/v>/g, (_whole, index: string) => ` t="s"><v>${strings[Number(index)]}</v>`),
      );
    } else {
      parts.set(name, xml);
    }
  }
  return parts;
}

function tableNames(sheet: ExcelJS.Worksheet): string[] {
  return Object.keys((sheet as unknown as { tables: Record<string, unknown> }).tables ?? {});
}

describe('the Word compliance package', () => {
  let draft: WordParts;
  let final: WordParts;

  beforeAll(async () => {
    draft = await readWord(await buildCompliancePackage(input));
    final = await readWord(
      await buildCompliancePackage(
        { ...input, revision: { ...input.revision, draft: false }, review: undefined },
        {
          cutSheets: new Map([[input.document.luminaireTypes[0]!.tag, 'Downlight cut sheet.pdf']]),
        },
      ),
    );
  });

  it('has the project’s set-up and the revision on the cover', () => {
    const { project } = input;
    for (const text of [
      'Lighting energy compliance package',
      project.name,
      project.address!,
      project.jurisdiction!,
      'IECC 2021',
      'Space-by-space method',
      'Inch-pound (ft², W/ft²)',
      `Zone ${input.result.exterior!.lightingZone}`,
      'Prepared by',
      '2 (draft)',
      'March 14, 2025',
      'Draft',
      fingerprint,
    ]) {
      expect(draft.body, text).toContain(text);
    }
    expect(final.body).not.toContain('2 (draft)');
  });

  it('gives the summary totals in the words and units of the web app', () => {
    const { interior } = input.result;
    expect(draft.body).toContain(withUnits.watts(interior.allowanceW));
    expect(draft.body).toContain(withUnits.watts(interior.installedW));
    expect(draft.body).toMatch(/Overall result: Complies/);
    expect(draft.body).toContain(`(${withUnits.percent(interior.marginPct)}) to spare`);
    // Thousands separators, as the web app shows them.
    expect(withUnits.watts(interior.allowanceW)).toMatch(/^\d{1,3}(,\d{3})+ W$/);
  });

  it('lists every space, grouped by level with subtotals', () => {
    for (const space of input.result.interior.spaces) expect(draft.body).toContain(space.name);
    expect(draft.body).toContain('Subtotal, Level 1');
    expect(draft.body).toContain('Subtotal, Level 2');
    expect(draft.body.indexOf('Subtotal, Level 1')).toBeLessThan(draft.body.indexOf('Subtotal, Level 2'));
    expect(draft.body).toContain('Building total');
  });

  it('lists the luminaire schedule with the cut sheet where one is on file', () => {
    for (const type of input.document.luminaireTypes) expect(draft.body).toContain(type.description);
    expect(draft.body).toContain('None on file');
    expect(final.body).toContain('Downlight cut sheet.pdf');
  });

  it('carries the fingerprint in the footer of every section and the draft mark in every header of a draft only', () => {
    expect(draft.sections.length).toBeGreaterThanOrEqual(3);
    for (const section of draft.sections) {
      expect(section.footer).toContain(fingerprint);
      expect(section.header).toContain(draftMark);
    }
    for (const section of final.sections) {
      expect(section.footer).toContain(fingerprint);
      expect(section.header).not.toContain('DRAFT');
    }
    expect(final.body).not.toContain('DRAFT');
  });

  it('carries the cautions and every unverified value with its source', () => {
    expect(input.result.cautions.length).toBeGreaterThanOrEqual(3);
    for (const caution of input.result.cautions) expect(draft.body).toContain(caution);
    expect(draft.body).toMatch(/emergency or egress lighting/);
    expect(draft.body).toMatch(/authority having jurisdiction govern/);
    expect(input.result.unverifiedValues.length).toBeGreaterThan(0);
    for (const value of input.result.unverifiedValues) {
      expect(draft.body).toContain(value.what);
      expect(draft.body).toContain(value.citation.short);
    }
  });

  it('has the controls with what is provided, the daylight zones, the exterior, the statement and the history', () => {
    const controlled = input.document.spaces.flatMap((space) => space.controls).find((control) => control.device !== undefined);
    expect(controlled).toBeDefined();
    expect(draft.body).toContain(controlled!.device!);
    expect(draft.body).toContain('Daylight zones');
    expect(draft.body).toContain('Primary sidelit');
    for (const application of input.result.exterior!.applications) expect(draft.body).toContain(application.label);
    expect(draft.body).toContain('Statement of the designer of record');
    expect(draft.body).toContain('Signature');
    expect(draft.body).toContain('Revision history');
    expect(draft.body).toContain(earlier);
  });

  it('draws the plan of each daylit room with a rectangle as a picture, as the Daylight page does', async () => {
    const zip = await JSZip.loadAsync(await buildCompliancePackage(input));
    const drawn = input.result.interior.spaces.filter((space) => space.daylight.geometryEvaluated && space.daylight.zones.length > 0);
    expect(drawn.length).toBeGreaterThan(0);
    const media = Object.keys(zip.files).filter((name) => name.startsWith('word/media/') && name.endsWith('.png'));
    const documentXml = await zip.file('word/document.xml')!.async('string');
    // One picture per daylit room; rooms drawn alike share one image file.
    expect(documentXml.match(/<w:drawing>/g)).toHaveLength(drawn.length);
    expect(media.length).toBeGreaterThan(0);
    expect(media.length).toBeLessThanOrEqual(drawn.length);
    expect(documentXml).toContain(`Plan of ${drawn[0]!.name}`);
    for (const name of media) {
      const picture = await sharp(await zip.file(name)!.async('nodebuffer')).metadata();
      expect(picture.format).toBe('png');
      // Drawn at 1.25 times the page's 560 × 320 drawing size at most, plus its margins (contract/daylight-plan.ts).
      expect(picture.width).toBeGreaterThan(300);
      expect(picture.width).toBeLessThanOrEqual(1.25 * (560 + 44 + 64));
      expect(picture.height).toBeLessThanOrEqual(1.25 * (320 + 28 + 56));
    }
    expect(wordText(documentXml)).toContain('Plans of the daylit rooms');
  });

  it('has the review record when there is one', () => {
    expect(draft.body).toContain('Review record, round 1');
    expect(draft.body).toContain(reviewItem.title);
    expect(draft.body).toContain('Needs revision');
    expect(draft.body).toContain('Added to sheet E-201.');
    expect(final.body).not.toContain('Review record');
  });

  it('shows no internal keys or enum values', () => {
    for (const code of [
      'does-not-comply',
      'not-met',
      'to-verify',
      'exception-claimed',
      'primary-sidelit',
      'iecc-2021',
      'building-area-type',
    ]) {
      expect(draft.body).not.toContain(code);
    }
  });

  it('writes its table rows as the very markup docx writes for them, text escaped', async () => {
    // A name with every character XML escapes, and one XML 1.0 cannot hold (dropped: docx would write it and break the file).
    const name = `Lobby & <Stair> "A" 'B' 🏛️\u0007`;
    const spaces = input.result.interior.spaces.map((space, index) => (index === 0 ? { ...space, name } : space));
    const named = { ...input, result: { ...input.result, interior: { ...input.result.interior, spaces } } };
    // The plans' pictures get a new random name in each build (docx names them): compared without them.
    const documentXml = async (buffer: Buffer) =>
      (await (await JSZip.loadAsync(buffer)).file('word/document.xml')!.async('string')).replace(
        /<w:drawing>[\s\S]*?<\/w:drawing>/g,
        '<w:drawing/>',
      );
    const fast = await documentXml(await buildCompliancePackage(named));
    const reference = await documentXml(await buildCompliancePackage(named, { tablesViaDocx: true }));
    expect(fast).toContain('Lobby &amp; &lt;Stair&gt; &quot;A&quot; &apos;B&apos; 🏛️</w:t>');
    expect(fast).not.toContain('\u0007');
    expect(fast).not.toContain('TableBodyRows');
    expect(fast).toBe(reference.replace('\u0007', ''));
  });

  it('streams the document into the file in UTF-8 pieces that never cut a character in two', () => {
    // 🏛 is U+1F3DB, two UTF-16 code units (a surrogate pair), four bytes in UTF-8.
    const texts = ['ab🏛cd', '', '🏛🏛', 'é'.repeat(5)];
    for (const size of [1, 2, 3, 4, 1 << 20]) {
      const pieces = [...utf8Pieces(texts, size)];
      expect(Buffer.concat(pieces).toString('utf8')).toBe(texts.join(''));
      for (const piece of pieces) expect(piece.toString('utf8')).not.toContain('\uFFFD');
    }
  });
});

describe('the Excel compliance workbook', () => {
  let workbook: ExcelJS.Workbook;
  let result: EvaluationResult;

  let formulas: RecomputedCell[];
  /** A cell's value as the formula engine recomputed it from the workbook's entered figures. */
  let recomputed: (sheet: string, address: string) => number;

  beforeAll(async () => {
    result = input.result;
    const file = await buildComplianceWorkbook(input);
    workbook = await readWorkbook(file);
    formulas = await recomputeWorkbook(workbook, file);
    recomputed = recomputedIn(formulas);
  });

  it('recomputes every formula with a formula engine to the value cached in the file', () => {
    // fast-formula-parser is the engine (its README: an Excel formula parser and evaluator); see test/support/workbook-formulas.ts.
    expect(formulas.length).toBeGreaterThan(100);
    const used = new Set(formulas.flatMap((cell) => [...cell.formula.matchAll(/([A-Z]+)\(/g)].map((match) => match[1])));
    expect([...used].sort()).toEqual(['COUNTIF', 'IF', 'SUM', 'SUMIFS']);
    expect(formulas.some((cell) => /![$A-Z]+\d/.test(cell.formula))).toBe(true);
    for (const cell of formulas) {
      const where = `${cell.sheet}!${cell.address} ${cell.formula}`;
      expect(cell.recomputed, where).not.toBeInstanceOf(Error);
      expect(cell.cached, `${where} has a cached value`).toBeDefined();
      if (typeof cell.cached === 'number') {
        expect(typeof cell.recomputed, where).toBe('number');
        expect(Math.abs((cell.recomputed as number) - cell.cached), where).toBeLessThanOrEqual(cachedRounding(cell.cached));
      } else {
        expect(cell.recomputed, where).toBe(cell.cached);
      }
    }
  });

  it('has the eight sheets, each with its header row frozen', () => {
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual([
      'Summary',
      'Spaces',
      'Luminaires',
      'Counts',
      'Controls',
      'Daylight',
      'Exterior',
      'Sources',
    ]);
    for (const sheet of workbook.worksheets) {
      expect(sheet.views[0], sheet.name).toMatchObject({ state: 'frozen', ySplit: 1 });
      expect(sheet.headerFooter.oddFooter, sheet.name).toContain(fingerprint);
      expect(sheet.headerFooter.oddHeader, sheet.name).toContain('DRAFT — not for permit');
    }
  });

  it('has a named table on each sheet of rows', () => {
    expect(tableNames(workbook.getWorksheet('Spaces')!)).toEqual(['SpaceAllowances']);
    expect(tableNames(workbook.getWorksheet('Counts')!)).toEqual(['LuminaireCounts']);
    expect(tableNames(workbook.getWorksheet('Luminaires')!)).toEqual(['LuminaireSchedule']);
    expect(tableNames(workbook.getWorksheet('Controls')!)).toEqual(['ControlRequirements']);
    expect(tableNames(workbook.getWorksheet('Daylight')!)).toEqual(['DaylightZones']);
    expect(tableNames(workbook.getWorksheet('Exterior')!)).toEqual(['ExteriorApplications']);
    expect(tableNames(workbook.getWorksheet('Sources')!)).toEqual(['ValueSources']);
    expect(tableNames(workbook.getWorksheet('Summary')!)).toEqual(['LevelSubtotals']);
  });

  it('computes each space’s allowance as area × LPD with the engine’s value cached', () => {
    const sheet = workbook.getWorksheet('Spaces')!;
    const spaces = orderedSpaces(result);
    spaces.forEach((space, index) => {
      const row = 2 + index;
      expect(sheet.getCell(row, 3).value).toBe(space.name);
      const allowance = sheet.getCell(row, 8);
      expect(formulaOf(allowance)).toBe(`E${row}*F${row}+G${row}`);
      expect(cached(allowance)).toBe(Number(space.allowanceW));
      // The formula engine recomputes the engine's allowance and installed watts to their reported 0.1 W.
      expect(Math.abs(recomputed('Spaces', `H${row}`) - Number(space.allowanceW))).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(recomputed('Spaces', `J${row}`) - Number(space.installedW))).toBeLessThanOrEqual(0.05 + 1e-9);
      const installed = sheet.getCell(row, 10);
      expect(formulaOf(installed)).toMatch(new RegExp(`^SUMIFS\\(Counts!\\$H\\$2:\\$H\\$\\d+,Counts!\\$A\\$2:\\$A\\$\\d+,A${row},`));
      expect(cached(installed)).toBe(Number(space.installedW));
      expect(formulaOf(sheet.getCell(row, 13))).toBe(`H${row}-J${row}`);
      expect(cached(sheet.getCell(row, 13))).toBe(Number(space.marginW));
    });
    expect(sheet.getCell(2, 8).numFmt).toBe('#,##0 "W"');
    expect(sheet.getCell(2, 6).numFmt).toBe('0.00 "W/ft²"');
    expect(sheet.getCell(2, 5).numFmt).toBe('#,##0 "ft²"');
    const totals = 2 + spaces.length;
    expect(sheet.getCell(totals, 1).value).toBe('Total');
    expect(formulaOf(sheet.getCell(totals, 8))).toBe(`SUM(H2:H${totals - 1})`);
  });

  it('computes each luminaire line as count × watts each, the engine’s watts cached', () => {
    const sheet = workbook.getWorksheet('Counts')!;
    const lines = orderedSpaces(result).flatMap((space) => space.luminaires);
    let installed = 0;
    lines.forEach((line, index) => {
      const row = 2 + index;
      expect(sheet.getCell(row, 4).value).toBe(line.tag);
      expect(formulaOf(sheet.getCell(row, 8))).toBe(`F${row}*G${row}`);
      expect(cached(sheet.getCell(row, 8))).toBe(Number(line.watts));
      if (line.use !== 'exempt') installed += recomputed('Counts', `H${row}`);
    });
    expect(Math.abs(installed - Number(result.interior.installedW))).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(sheet.getCell(2, 8).numFmt).toBe('#,##0 "W"');
  });

  it('totals the interior and exterior on the summary with live formulas and the engine’s values cached', () => {
    const sheet = workbook.getWorksheet('Summary')!;
    const allowance = summaryCell(sheet, 'Interior lighting power', 'Allowance');
    expect(formulaOf(allowance)).toMatch(/^SUM\(Spaces!\$I\$2:\$I\$\d+\)\+B\d+$/);
    expect(cached(allowance)).toBe(Number(result.interior.allowanceW));
    const installed = summaryCell(sheet, 'Interior lighting power', 'Installed');
    expect(formulaOf(installed)).toMatch(/^SUM\(Spaces!\$J\$2:\$J\$\d+\)$/);
    expect(cached(installed)).toBe(Number(result.interior.installedW));
    const margin = summaryCell(sheet, 'Interior lighting power', 'Margin');
    expect(formulaOf(margin)).toBe(`${allowance.address}-${installed.address}`);
    expect(cached(margin)).toBe(Number(result.interior.marginW));
    expect(margin.numFmt).toBe('#,##0 "W"');
    const verdict = summaryCell(sheet, 'Interior lighting power', 'Interior power');
    expect((verdict.value as ExcelJS.CellFormulaValue).result).toBe('Within allowance');
    expect(summaryCell(sheet, 'Result', 'Overall').value).toBe('Complies');

    // The totals as the formula engine recomputes them from the spaces' areas, LPDs and counts are the engine's.
    expect(Math.abs(recomputed('Summary', allowance.address) - Number(result.interior.allowanceW))).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(Math.abs(recomputed('Summary', installed.address) - Number(result.interior.installedW))).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(Math.abs(recomputed('Summary', exteriorTotal(sheet)) - Number(result.exterior!.allowanceW))).toBeLessThanOrEqual(0.05 + 1e-9);

    const exterior = summaryCell(sheet, 'Exterior lighting power', 'Allowance');
    expect(formulaOf(exterior)).toMatch(/^B\d+\+SUM\(Exterior!\$F\$2:\$F\$\d+\)$/);
    expect(cached(exterior)).toBe(Number(result.exterior!.allowanceW));
  });

  it('subtotals by level with SUMIFS over the spaces', () => {
    const sheet = workbook.getWorksheet('Summary')!;
    for (const level of result.interior.levels!) {
      let row = 1;
      while (row <= sheet.rowCount && sheet.getCell(row, 1).value !== level.level) row++;
      expect(row, level.level).toBeLessThanOrEqual(sheet.rowCount);
      const allowance = sheet.getCell(row, 3);
      expect(formulaOf(allowance)).toBe(
        `SUMIFS(Spaces!$I$2:$I$${1 + result.interior.spaces.length},Spaces!$B$2:$B$${1 + result.interior.spaces.length},A${row})`,
      );
      expect(cached(allowance)).toBe(Number(level.allowanceW));
      expect(cached(sheet.getCell(row, 4))).toBe(Number(level.installedW));
      expect(Math.abs(recomputed('Summary', allowance.address) - Number(level.allowanceW)), level.level).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  it('counts the controls by status and colours the verdict words', () => {
    const sheet = workbook.getWorksheet('Summary')!;
    const met = summaryCell(sheet, 'Controls', 'Met');
    expect(formulaOf(met)).toMatch(/^COUNTIF\(Controls!\$G\$2:\$G\$\d+,"Met"\)$/);
    const lines = [
      ...result.interior.spaces.flatMap((space) => space.controls),
      ...result.exterior!.applications.flatMap((application) => application.controls),
    ];
    expect(cached(met)).toBe(lines.filter((line) => line.status === 'met').length);
    const spaces = workbook.getWorksheet('Spaces')!;
    const rules = (spaces as unknown as { conditionalFormattings: { ref: string; rules: unknown[] }[] }).conditionalFormattings;
    expect(rules.map((rule) => rule.ref)).toContain(`P2:P${1 + result.interior.spaces.length}`);
  });

  it('lists every unverified value with its source on the Sources sheet', () => {
    const sheet = workbook.getWorksheet('Sources')!;
    result.unverifiedValues.forEach((value, index) => {
      expect(sheet.getCell(2 + index, 1).value).toBe(value.what);
      expect(sheet.getCell(2 + index, 2).value).toBe(value.citation.short);
      expect(sheet.getCell(2 + index, 4).value).toEqual(expect.any(String));
    });
  });

  it('writes the table rows after each first one as the very markup exceljs writes for them, text escaped', async () => {
    // Names with every character XML escapes, one XML 1.0 cannot hold (exceljs drops it) and spaces
    // exceljs keeps with xml:space, on every space, so the rows written after packing carry them.
    const spaces = input.result.interior.spaces.map((space, index) => ({
      ...space,
      name: index % 2 === 0 ? `${space.name} & <Stair> "A" 'B'\u0007` : ` ${space.name}\n`,
    }));
    const named = { ...input, result: { ...input.result, interior: { ...input.result.interior, spaces } } };
    const fast = await buildComplianceWorkbook(named);
    const reference = await buildComplianceWorkbook(named, { rowsViaExceljs: true });
    const fastParts = await partsWithStrings(fast);
    const referenceParts = await partsWithStrings(reference);
    expect([...fastParts.keys()]).toEqual([...referenceParts.keys()]);
    for (const [name, xml] of referenceParts) expect(fastParts.get(name), name).toBe(xml);
    // The two files differ in where the later rows' strings sit among the shared strings.
    const spacesSheet = async (file: Buffer) => (await JSZip.loadAsync(file)).file('xl/worksheets/sheet2.xml')!.async('string');
    expect(await spacesSheet(fast)).not.toBe(await spacesSheet(reference));
    const read = await readWorkbook(fast);
    const names = orderedSpaces(named.result).map((space) => space.name.replace('\u0007', ''));
    expect(names.length).toBeGreaterThan(2);
    names.forEach((name, index) => expect(read.getWorksheet('Spaces')!.getCell(2 + index, 3).value).toBe(name));
  });

  it('writes SI formats and reproduces SI allowances where the project is in SI', async () => {
    // The demo's figures read as metres: a different building, but a valid SI document for the same tables.
    const siDocument = validateDocument({ ...input.document, units: 'si' }, tables);
    expect(siDocument.valid, JSON.stringify(siDocument.valid ? [] : siDocument.problems)).toBe(true);
    const document = (siDocument as { document: EvaluationDocument }).document;
    const siResult = evaluate(document, tables);
    const siFile = await buildComplianceWorkbook({ ...input, project: { ...input.project, units: 'si' }, document, result: siResult });
    const si = await readWorkbook(siFile);
    const siRecomputed = recomputedIn(await recomputeWorkbook(si, siFile));
    const sheet = si.getWorksheet('Spaces')!;
    expect(sheet.getCell(2, 6).numFmt).toBe('0.00 "W/m²"');
    expect(sheet.getCell(2, 5).numFmt).toBe('#,##0.0 "m²"');
    orderedSpaces(siResult).forEach((space, index) => {
      const row = 2 + index;
      expect(Math.abs(siRecomputed('Spaces', `H${row}`) - Number(space.allowanceW)), space.name).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(cached(sheet.getCell(row, 8))).toBe(Number(space.allowanceW));
    });
    const summary = si.getWorksheet('Summary')!;
    expect(cached(summaryCell(summary, 'Interior lighting power', 'Allowance'))).toBe(Number(siResult.interior.allowanceW));
  });
});
