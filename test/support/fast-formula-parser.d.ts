// The little of fast-formula-parser (MIT, JavaScript without types) the workbook check uses, as its README describes it.
declare module 'fast-formula-parser' {
  export interface CellRef {
    sheet: string;
    row: number;
    col: number;
  }
  export interface RangeRef {
    sheet: string;
    from: { row: number; col: number };
    to: { row: number; col: number };
  }
  export type FormulaValue = number | string | boolean | null | FormulaValue[][];
  /** What a function given in `functions` receives for each argument: a range's values as rows. */
  export interface FunctionArg {
    value: FormulaValue;
    isArray: boolean;
    isRangeRef?: boolean;
    isCellRef?: boolean;
  }
  export interface ParserConfig {
    functions?: Record<string, (...args: FunctionArg[]) => FormulaValue>;
    onCell?: (ref: CellRef) => FormulaValue;
    onRange?: (ref: RangeRef) => FormulaValue[][];
  }
  export const MAX_ROW: number;
  export const MAX_COLUMN: number;
  export const Criteria: { parse(criteria: FormulaValue): { op: string; value: unknown; match?: boolean } };
  export default class FormulaParser {
    constructor(config?: ParserConfig);
    parse(formula: string, position: CellRef, allowReturnArray?: boolean): FormulaValue | Error;
    static MAX_ROW: number;
    static Criteria: { parse(criteria: FormulaValue): { op: string; value: unknown; match?: boolean } };
  }
}

declare module 'fast-formula-parser/formulas/operators.js' {
  export const Infix: { compareOp(value1: unknown, infix: string, value2: unknown, isArray1: boolean, isArray2: boolean): boolean };
}
