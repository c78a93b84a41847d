import type { DocumentProblem, EvaluationDocumentInput } from './document.js';
import { validateDocument } from './document.js';
import type { EditionData } from './edition-data.js';
import { evaluate } from './evaluate.js';
import { dec, reported } from './numbers.js';
import type { ControlLine, ControlStatus, EvaluationResult } from './result.js';
import { satisfies, sizeCondition } from './size-conditions.js';
import { areaToSquareFeet, type UnitSystem } from './units.js';

/**
 * One project's design under other editions: each space type (or building area type) is mapped
 * to the target edition's row — the same key, or a row the reference data records as equal
 * (directly or through another edition) — and the design is evaluated there. What cannot be
 * mapped is listed, never guessed.
 */

export interface MappedRow {
  space: string;
  from: string;
  to: string;
}

/** Where a control is required, not required, or to verify: one of a set of alternatives counts as required. */
export type RequirementKind = 'required' | 'not-required' | 'to-verify';

/** The control lines of one space (or exterior application) whose requirement differs from the project's own edition. */
export interface ControlChange {
  /** The space's or exterior application's name. */
  place: string;
  exterior: boolean;
  changes: {
    control: string;
    /** Under this edition; a control the edition does not list for the place is not required there. */
    requirement: RequirementKind;
    /** Under the project's own edition. */
    before: RequirementKind;
    /** The line's status under this edition ('not-required' where the edition has no such line). */
    status: ControlStatus;
    section: string;
  }[];
}

export interface EditionComparison {
  edition: string;
  title: string;
  /** 'evaluated'; 'not-mapped' when a space has no counterpart; 'not-valid' when the mapped design does not fit the edition. */
  status: 'evaluated' | 'not-mapped' | 'not-valid';
  /** Spaces (and exterior applications) with no counterpart in this edition. */
  unmapped: { what: 'space' | 'exterior application'; name: string; type: string }[];
  /** Where a space's type has another key in this edition. */
  remapped: MappedRow[];
  /** Controls recorded for the project's edition that this edition does not have. */
  controlsNotCarried: string[];
  /** Per space, the controls whose requirement is not the same as under the project's own edition (none for the own edition). */
  controlChanges: ControlChange[];
  problems: DocumentProblem[];
  result: {
    verdict: 'complies' | 'does-not-comply' | 'incomplete';
    units: UnitSystem;
    /** The floor area the allowance counts, in the project's units (ft² or m²). */
    area: string;
    allowanceW: string;
    installedW: string;
    marginW: string;
    marginPct: string | null;
    /** Watts per ft² or m² of that area; null without any. */
    allowanceLpd: string | null;
    installedLpd: string | null;
    /** Interior power alone: installed within the allowance. */
    interiorComplies: boolean;
    exterior: { allowanceW: string; installedW: string; marginW: string; complies: boolean } | null;
    controls: { met: number; notMet: number; toVerify: number };
    /** The control lines that fail or wait, by space: what changes under this edition. */
    open: { space: string; control: string; status: ControlStatus; section: string }[];
    /** How many values the evaluation used that are not checked against a published source. */
    unverifiedValues: number;
  } | null;
}

type Kind = 'space' | 'area';

/** Equal rows across editions, both ways, plus the same key in two editions. */
function equalities(editions: readonly EditionData[], kind: Kind): Map<string, Set<string>> {
  const edges = new Map<string, Set<string>>();
  const link = (a: string, b: string) => {
    if (!edges.has(a)) edges.set(a, new Set());
    if (!edges.has(b)) edges.set(b, new Set());
    edges.get(a)!.add(b);
    edges.get(b)!.add(a);
  };
  const byKey = new Map<string, string[]>();
  for (const edition of editions) {
    const rows = kind === 'space' ? edition.spaceTypes : edition.buildingAreaTypes;
    for (const row of rows) {
      const node = `${edition.id}\u0000${row.key}`;
      byKey.set(row.key, [...(byKey.get(row.key) ?? []), node]);
      if (row.equalsRowOf) link(node, `${row.equalsRowOf.edition}\u0000${row.equalsRowOf.key}`);
    }
  }
  for (const nodes of byKey.values()) for (let index = 1; index < nodes.length; index++) link(nodes[0]!, nodes[index]!);
  return edges;
}

/** The target's row for a key: breadth first through equal rows, at most three steps. */
function mapped(edges: Map<string, Set<string>>, from: string, key: string, to: EditionData, kind: Kind): string | null {
  const rows = new Set((kind === 'space' ? to.spaceTypes : to.buildingAreaTypes).map((row) => row.key));
  if (rows.has(key)) return key;
  let frontier = [`${from}\u0000${key}`];
  const seen = new Set(frontier);
  for (let step = 0; step < 3 && frontier.length > 0; step++) {
    const next: string[] = [];
    for (const node of frontier) {
      for (const neighbour of edges.get(node) ?? []) {
        if (seen.has(neighbour)) continue;
        seen.add(neighbour);
        const [edition, candidate] = neighbour.split('\u0000') as [string, string];
        if (edition === to.id && rows.has(candidate)) return candidate;
        next.push(neighbour);
      }
    }
    frontier = next;
  }
  return null;
}

/** A row sized by its name (an enclosed office of at most 250 ft²) that the space does not fit gives way to the sibling it fits. */
function fittingRow(to: EditionData, key: string, area: unknown, rooms: unknown, units: UnitSystem): string {
  const type = to.spaceTypes.find((row) => row.key === key)!;
  const condition = sizeCondition(type.sourceLabel);
  if (condition?.quantity !== 'area' || (typeof area !== 'string' && typeof area !== 'number')) return key;
  const each = areaToSquareFeet(dec(String(area)), units).dividedBy(
    typeof rooms === 'string' || typeof rooms === 'number' ? dec(String(rooms)) : 1,
  );
  if (satisfies(condition, each)) return key;
  const kind = type.sourceLabel.split('|')[0]!.trim();
  const sibling = to.spaceTypes.find((row) => {
    const other = sizeCondition(row.sourceLabel);
    return row.key !== key && row.sourceLabel.split('|')[0]!.trim() === kind && other?.quantity === 'area' && satisfies(other, each);
  });
  return sibling?.key ?? key;
}

/** `own` is the design's evaluation under `from`, which every other edition's control requirements are set against. */
export function compareEditions(
  document: EvaluationDocumentInput,
  from: EditionData,
  targets: readonly EditionData[],
  own: EvaluationResult,
): EditionComparison[] {
  const all = [from, ...targets];
  const spaceEdges = equalities(all, 'space');
  const areaEdges = equalities(all, 'area');
  const units = document.units;
  return targets.map((to): EditionComparison => {
    const comparison: EditionComparison = {
      edition: to.id,
      title: to.title,
      status: 'evaluated',
      unmapped: [],
      remapped: [],
      controlsNotCarried: [],
      controlChanges: [],
      problems: [],
      result: null,
    };
    const strategies = new Set<string>(to.controlStrategies.map((strategy) => strategy.key));
    const dropped = new Set<string>();
    const carry = <Control extends { strategy: string }>(controls: Control[] | undefined): Control[] =>
      (controls ?? []).filter((control) => {
        if (strategies.has(control.strategy)) return true;
        dropped.add(from.controlStrategies.find((strategy) => strategy.key === control.strategy)?.label ?? control.strategy);
        return false;
      });
    const spaces = document.spaces.map((space) => {
      const copy = { ...space, controls: carry(space.controls) };
      for (const [field, kind] of [
        ['spaceType', 'space'],
        ['controlSpaceType', 'space'],
        ['buildingAreaType', 'area'],
      ] as const) {
        const key = space[field];
        if (key === undefined) continue;
        const found = mapped(kind === 'space' ? spaceEdges : areaEdges, from.id, key, to, kind);
        const needed = field === (document.method === 'building-area' ? 'buildingAreaType' : 'spaceType');
        if (found === null) {
          if (needed) comparison.unmapped.push({ what: 'space', name: space.name, type: labelOf(from, kind, key) });
          delete copy[field];
          continue;
        }
        const fitted = kind === 'space' ? fittingRow(to, found, space.area, space.rooms, units) : found;
        if (fitted !== key && needed)
          comparison.remapped.push({ space: space.name, from: labelOf(from, kind, key), to: labelOf(to, kind, fitted) });
        copy[field] = fitted;
      }
      return copy;
    });
    const applications = new Set(to.exteriorApplications.map((application) => application.key));
    const exterior = document.exterior
      ? {
          ...document.exterior,
          applications: (document.exterior.applications ?? [])
            .filter((application) => {
              if (applications.has(application.key)) return true;
              comparison.unmapped.push({
                what: 'exterior application',
                name: from.exteriorApplications.find((row) => row.key === application.key)?.label ?? application.key,
                type: '',
              });
              return false;
            })
            .map((application) => ({ ...application, controls: carry(application.controls) })),
        }
      : undefined;
    comparison.controlsNotCarried = [...dropped];
    if (comparison.unmapped.some((entry) => entry.what === 'space')) {
      comparison.status = 'not-mapped';
      return comparison;
    }
    const allowances = new Set(to.additionalAllowances.map((allowance) => allowance.key));
    const target: EvaluationDocumentInput = {
      ...document,
      edition: to.id,
      spaces,
      ...(exterior ? { exterior } : {}),
      ...(document.retailDisplay
        ? { retailDisplay: { claims: (document.retailDisplay.claims ?? []).filter((claim) => allowances.has(claim.allowance)) } }
        : {}),
      // A jurisdiction's amendments belong to the edition it amends.
      amendments: [],
    };
    const outcome = validateDocument(target, to);
    if (!outcome.valid) {
      comparison.status = 'not-valid';
      comparison.problems = outcome.problems;
      return comparison;
    }
    const result = evaluate(outcome.document, to);
    comparison.result = summary(result);
    comparison.controlChanges = controlChanges(own, result);
    return comparison;
  });
}

/** What a comparison shows of one evaluation: the figures, and the control lines that fail or wait. */
export function summary(result: EvaluationResult): NonNullable<EditionComparison['result']> {
  const lines = result.interior.spaces.flatMap((space) => space.controls.map((line) => ({ space: space.name, line })));
  const exteriorLines = (result.exterior?.applications ?? []).flatMap((application) =>
    application.controls.map((line) => ({ space: application.label, line })),
  );
  const every = [...lines, ...exteriorLines];
  const { interior, exterior } = result;
  const area = dec(interior.area);
  const density = (watts: string) => (area.isZero() ? null : reported.density(dec(watts).dividedBy(area)));
  return {
    verdict: result.verdict,
    units: result.units,
    area: interior.area,
    allowanceW: interior.allowanceW,
    installedW: interior.installedW,
    marginW: interior.marginW,
    marginPct: interior.marginPct,
    allowanceLpd: density(interior.allowanceW),
    installedLpd: density(interior.installedW),
    interiorComplies: interior.complies,
    exterior: exterior
      ? {
          allowanceW: exterior.allowanceW,
          installedW: exterior.installedW,
          marginW: reported.watts(dec(exterior.allowanceW).minus(exterior.installedW)),
          complies: exterior.complies,
        }
      : null,
    controls: {
      met: every.filter(({ line }) => line.status === 'met' || line.status === 'exception-claimed').length,
      notMet: every.filter(({ line }) => line.status === 'not-met').length,
      toVerify: every.filter(({ line }) => line.status === 'to-verify').length,
    },
    open: every
      .filter(({ line }) => line.status === 'not-met' || line.status === 'to-verify')
      .map(({ space, line }) => ({ space, control: line.label, status: line.status, section: line.section })),
    unverifiedValues: result.unverifiedValues.length,
  };
}

function requirementKind(line: ControlLine | undefined): RequirementKind {
  if (line === undefined || line.requirement === 'not-required') return 'not-required';
  return line.requirement === 'to-verify' ? 'to-verify' : 'required';
}

/**
 * Per space and exterior application (matched by id and key: the same design under both), each
 * control whose requirement under `other` is not the one under `own`: required, not required or to
 * verify. A requirement not decided from the data stays "to verify" on either side.
 */
export function controlChanges(own: EvaluationResult, other: EvaluationResult): ControlChange[] {
  const places = (result: EvaluationResult) => [
    ...result.interior.spaces.map((space) => ({ id: `space:${space.id}`, place: space.name, exterior: false, lines: space.controls })),
    ...(result.exterior?.applications ?? []).map((application) => ({
      id: `exterior:${application.key}`,
      place: application.label,
      exterior: true,
      lines: application.controls,
    })),
  ];
  const before = new Map(places(own).map((place) => [place.id, place.lines]));
  return places(other).flatMap(({ id, place, exterior, lines }): ControlChange[] => {
    const ownLines = before.get(id) ?? [];
    const byStrategy = new Map(ownLines.map((line) => [line.strategy, line]));
    const changes: ControlChange['changes'] = lines.flatMap((line) => {
      const was = requirementKind(byStrategy.get(line.strategy));
      const now = requirementKind(line);
      return was === now ? [] : [{ control: line.label, requirement: now, before: was, status: line.status, section: line.section }];
    });
    const listed = new Set(lines.map((line) => line.strategy));
    for (const line of ownLines) {
      if (listed.has(line.strategy) || requirementKind(line) === 'not-required') continue;
      changes.push({
        control: line.label,
        requirement: 'not-required',
        before: requirementKind(line),
        status: 'not-required',
        section: line.section,
      });
    }
    return changes.length === 0 ? [] : [{ place, exterior, changes }];
  });
}

function labelOf(edition: EditionData, kind: Kind, key: string): string {
  const rows = kind === 'space' ? edition.spaceTypes : edition.buildingAreaTypes;
  return rows.find((row) => row.key === key)?.label ?? key;
}
