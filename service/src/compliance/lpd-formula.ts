import type { DocumentProblem, EvaluationDocument, Space } from './document.js';
import type { EditionData, HeightRangeFt, LpdFormula, SpaceType } from './edition-data.js';
import { type Dec, dec, text } from './numbers.js';
import { type UnitSystem, lengthFromFeet, lengthToFeet, unitLabels } from './units.js';

/**
 * Space types whose allowance is a formula of the space's height: the atrium rows of 90.1-2013/2016
 * and IECC 2018 give W/ft² per foot of the atrium's total height (and above 40 ft a base plus so
 * much per foot), which the engine reads from the space's ceiling height.
 */

/** The allowed LPD (W/ft²) of a formula row for a space `heightFt` high. */
export function formulaLpd(formula: LpdFormula, heightFt: Dec): Dec {
  const perFoot = dec(formula.wPerFt2PerFt).times(heightFt);
  return formula.kind === 'per-foot-of-height' ? perFoot : dec(formula.baseWPerFt2).plus(perFoot);
}

/** The space type's allowed LPD before any room-geometry increase: its formula where it has one. */
export function spaceTypeLpd(type: SpaceType, space: Space, units: UnitSystem): Dec {
  if (type.lpdFormula === undefined) return dec(type.lpdWPerFt2);
  // The document check refuses such a space without its height, so one here is a caller's mistake.
  if (space.ceilingHeight === undefined) throw new Error(`space ${space.id} reached the engine without the height its allowance needs`);
  return formulaLpd(type.lpdFormula, lengthToFeet(dec(space.ceilingHeight), units));
}

function fits(range: HeightRangeFt, heightFt: Dec): boolean {
  if (range.above !== undefined && !heightFt.greaterThan(dec(range.above))) return false;
  if (range.atLeast !== undefined && heightFt.lessThan(dec(range.atLeast))) return false;
  if (range.below !== undefined && !heightFt.lessThan(dec(range.below))) return false;
  if (range.atMost !== undefined && heightFt.greaterThan(dec(range.atMost))) return false;
  return true;
}

/** The range in words and in the document's units: "more than 12.192 m", "at least 20 ft and at most 40 ft". */
function rangeWords(range: HeightRangeFt, units: UnitSystem): string {
  const length = (feet: string) => `${text(lengthFromFeet(dec(feet), units))} ${unitLabels(units).length}`;
  const words = [
    range.above !== undefined ? `more than ${length(range.above)}` : '',
    range.atLeast !== undefined ? `at least ${length(range.atLeast)}` : '',
    range.below !== undefined ? `less than ${length(range.below)}` : '',
    range.atMost !== undefined ? `at most ${length(range.atMost)}` : '',
  ];
  return words.filter(Boolean).join(' and ');
}

/**
 * Space-by-space only: a space on a formula row needs its height, and the height must be one the
 * row is for, or the allowance would come from the wrong line of the table.
 */
export function lpdFormulaProblems(document: EvaluationDocument, edition: EditionData): DocumentProblem[] {
  if (document.method !== 'space-by-space') return [];
  const formulas = new Map(edition.spaceTypes.flatMap((type) => (type.lpdFormula ? [[type.key, type.lpdFormula] as const] : [])));
  const problems: DocumentProblem[] = [];
  document.spaces.forEach((space, index) => {
    const formula = space.spaceType === undefined ? undefined : formulas.get(space.spaceType);
    if (formula === undefined) return;
    const path = `spaces.${index}.ceilingHeight`;
    if (space.ceilingHeight === undefined) {
      problems.push({ path, message: "The atrium's allowance depends on its height: give the ceiling height." });
      return;
    }
    const heightFt = lengthToFeet(dec(space.ceilingHeight), document.units);
    if (!fits(formula.heightFt, heightFt)) {
      problems.push({
        path,
        message: `This space type is for atria ${rangeWords(formula.heightFt, document.units)} high; choose the atrium row for a height of ${space.ceilingHeight} ${unitLabels(document.units).length}.`,
      });
    }
  });
  return problems;
}
