import type { EvaluationDocumentInput } from '../../../service/src/compliance/index';
import { ashrae2019, ashrae2022, iecc2021, run } from '../../../test/calc/fixtures';
import type { ControlLine, EvaluationResult, SpaceResult } from '../app/core/api/api-types';

/**
 * A result for a spec from the service's own engine (`service/src/compliance/`, pure functions over
 * plain data), so a page is tested against what the evaluation really answers rather than a hand-made
 * shape. The editions are the calculation tests' small ones (`test/calc/fixtures.ts`), every value
 * there named with its source.
 */
const editions = { 'iecc-2021': iecc2021, 'ashrae-90.1-2019': ashrae2019, 'ashrae-90.1-2022': ashrae2022 } as const;

export type SpecDocument = EvaluationDocumentInput & { edition: keyof typeof editions };

/** Validates the document (a problem fails the spec with the list) and evaluates it. */
export function evaluated(document: SpecDocument): EvaluationResult {
  return run(document, editions[document.edition]);
}

/** The space of that id in a result; fails the spec when the evaluation has none. */
export function spaceOf(result: EvaluationResult, id: string): SpaceResult {
  const space = result.interior.spaces.find((entry) => entry.id === id);
  if (space === undefined) throw new Error(`the evaluation has no space ${id}`);
  return space;
}

/** The line of that strategy among a space's or an exterior application's control lines; fails the spec when there is none. */
export function lineOf(owner: { controls: readonly ControlLine[] }, strategy: string): ControlLine {
  const line = owner.controls.find((entry) => entry.strategy === strategy);
  if (line === undefined) throw new Error(`the evaluation gives no ${strategy} line here`);
  return line;
}
