import type ExcelJS from 'exceljs';
import JSZip from 'jszip';
import FormulaParser, { type FormulaValue, type FunctionArg } from 'fast-formula-parser';
import { Infix } from 'fast-formula-parser/formulas/operators.js';
import { xmlEntitiesRead } from './xml-text.js';

/** One formula cell of a workbook as read back: its formula, the value cached in the file, and the value recomputed. */
export interface RecomputedCell {
  sheet: string;
  address: string;
  formula: string;
  cached: unknown;
  recomputed: FormulaValue | Error;
}

/**
 * Recomputes every formula of a workbook read back with exceljs using a real formula engine,
 * fast-formula-parser (MIT; lexes, parses and evaluates Excel formulas: its README,
 * https://github.com/LesterLyu/fast-formula-parser). A formula's references are resolved to the
 * cells' values, and a referenced formula cell is itself recomputed from its own inputs (never its
 * cached value), so every chain runs from the entered figures. The engine's SUMIFS is an empty
 * placeholder (formulas/functions/math.js), so SUMIFS is given here, built as its SUMIF is: the
 * engine's own criteria (`Criteria.parse`) and comparison (`Infix.compareOp`) for each pair.
 */
export async function recomputeWorkbook(workbook: ExcelJS.Workbook, file: Buffer): Promise<RecomputedCell[]> {
  const cachedInFile = await cachedValues(file, workbook.worksheets.length);
  const memo = new Map<string, FormulaValue | Error>();
  const busy = new Set<string>();

  const valueOf = (sheetName: string, row: number, col: number): FormulaValue => {
    const sheet = workbook.getWorksheet(sheetName);
    if (!sheet) throw new Error(`a formula refers to a sheet the workbook has not: ${sheetName}`);
    const cell = sheet.getCell(row, col);
    const value = cell.value;
    if (value === null || value === undefined) return null;
    if (typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean') return value;
    if (typeof value === 'object' && 'formula' in value) {
      const result = recompute(sheetName, cell);
      if (result instanceof Error) throw result;
      return result;
    }
    if (typeof value === 'object' && 'richText' in value) return value.richText.map((part) => part.text).join('');
    throw new Error(`${sheetName}!${cell.address} holds a value the check does not read`);
  };

  // The engine's parser is not re-entrant, and a formula's reference to another formula is
  // recomputed while the first is parsed: one parser per depth of that nesting.
  const parsers: FormulaParser[] = [];
  let depth = 0;
  const config: ConstructorParameters<typeof FormulaParser>[0] = {
    onCell: ({ sheet, row, col }) => valueOf(sheet, row, col),
    onRange: ({ sheet, from, to }) => {
      const worksheet = workbook.getWorksheet(sheet);
      if (!worksheet) throw new Error(`a formula refers to a sheet the workbook has not: ${sheet}`);
      // A whole column or row stops at the sheet's last row or column in use.
      const lastRow = Math.min(to.row, worksheet.rowCount);
      const lastCol = Math.min(to.col, worksheet.columnCount);
      const rows: FormulaValue[][] = [];
      for (let row = from.row; row <= lastRow; row++) {
        const values: FormulaValue[] = [];
        for (let col = from.col; col <= lastCol; col++) values.push(valueOf(sheet, row, col));
        rows.push(values);
      }
      return rows;
    },
    functions: {
      SUMIFS: (sumRange: FunctionArg, ...pairs: FunctionArg[]) => {
        const sums = sumRange.value as FormulaValue[][];
        if (pairs.length === 0 || pairs.length % 2 !== 0) throw new Error('SUMIFS takes a sum range and pairs of range and criteria');
        const tests: { range: FormulaValue[][]; criteria: ReturnType<typeof FormulaParser.Criteria.parse>; isArray: boolean }[] = [];
        for (let index = 0; index < pairs.length; index += 2) {
          const range = pairs[index]!.value as FormulaValue[][];
          if (range.length !== sums.length || range[0]?.length !== sums[0]?.length) throw new Error('SUMIFS ranges differ in size');
          const criteria = pairs[index + 1]!;
          tests.push({ range, criteria: FormulaParser.Criteria.parse(criteria.value), isArray: criteria.isArray });
        }
        let total = 0;
        sums.forEach((row, rowIndex) =>
          row.forEach((value, colIndex) => {
            if (typeof value !== 'number') return;
            const matches = tests.every(({ range, criteria, isArray }) => {
              const candidate = range[rowIndex]![colIndex]!;
              if (criteria.op === 'wc') return criteria.match === (criteria.value as RegExp).test(String(candidate));
              return Infix.compareOp(candidate, criteria.op, criteria.value, Array.isArray(candidate), isArray);
            });
            if (matches) total += value;
          }),
        );
        return total;
      },
    },
  };

  function recompute(sheetName: string, cell: ExcelJS.Cell): FormulaValue | Error {
    const key = `${sheetName}!${cell.address}`;
    const known = memo.get(key);
    if (known !== undefined) return known;
    if (busy.has(key)) throw new Error(`${key} refers to itself`);
    busy.add(key);
    const formula = (cell.value as ExcelJS.CellFormulaValue).formula;
    let result: FormulaValue | Error;
    const parser = (parsers[depth] ??= new FormulaParser(config));
    depth += 1;
    try {
      result = parser.parse(formula, { sheet: sheetName, row: Number(cell.row), col: Number(cell.col) });
    } catch (error) {
      result = error instanceof Error ? error : new Error(String(error));
    } finally {
      depth -= 1;
    }
    busy.delete(key);
    memo.set(key, result);
    return result;
  }

  const cells: RecomputedCell[] = [];
  workbook.worksheets.forEach((sheet, index) => {
    const inFile = cachedInFile[index]!;
    const seen: string[] = [];
    sheet.eachRow((row) =>
      row.eachCell((cell) => {
        const value = cell.value;
        if (value === null || typeof value !== 'object') return;
        if ('sharedFormula' in value)
          throw new Error(`${sheet.name}!${cell.address} holds a shared formula, which the check does not read`);
        if (!('formula' in value)) return;
        seen.push(cell.address);
        cells.push({
          sheet: sheet.name,
          address: cell.address,
          formula: value.formula,
          cached: inFile.get(cell.address),
          recomputed: recompute(sheet.name, cell),
        });
      }),
    );
    // The sheet's part in the file holds these very formula cells, so the cached values are the right sheet's.
    if ([...inFile.keys()].sort().join() !== [...seen].sort().join())
      throw new Error(`the file's formula cells of ${sheet.name} differ from exceljs's`);
  });
  return cells;
}

/**
 * The cached value (`<v>`) of every formula cell, read from each sheet's part of the file itself:
 * exceljs reads a cached 0 back as no value. Sheets are `xl/worksheets/sheet1.xml` … in the
 * workbook's order, as exceljs writes them (checked above against the formula cells).
 */
async function cachedValues(file: Buffer, sheets: number): Promise<Map<string, number | string | boolean | undefined>[]> {
  const zip = await JSZip.loadAsync(file);
  const parts: Map<string, number | string | boolean | undefined>[] = [];
  for (let index = 1; index <= sheets; index++) {
    const xml = await zip.file(`xl/worksheets/sheet${index}.xml`)!.async('string');
    const values = new Map<string, number | string | boolean | undefined>();
    for (const match of xml.matchAll(/<c r="([A-Z]+[0-9]+)"([^>]*)><f>[^<]*<\/f>(?:<v>([^<]*)<\/v>)?<\/c>/g)) {
      const type = / t="(\w+)"/.exec(match[2]!)?.[1];
      const text = match[3];
      values.set(
        match[1]!,
        text === undefined ? undefined : type === 'str' ? xmlEntitiesRead(text) : type === 'b' ? text === '1' : Number(text),
      );
    }
    parts.push(values);
  }
  return parts;
}
