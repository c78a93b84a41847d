import type { DocumentProblem, EvaluationDocumentInput } from './document.js';
import { validateDocument } from './document.js';
import type { EditionData } from './edition-data.js';
import { evaluate } from './evaluate.js';
import { dec } from './numbers.js';
import type { ControlStatus, EvaluationResult } from './result.js';
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
  problems: DocumentProblem[];
  result: {
    verdict: 'complies' | 'does-not-comply' | 'incomplete';
    allowanceW: string;
    installedW: string;
    marginW: string;
    marginPct: string | null;
    exterior: { allowanceW: string; installedW: string; complies: boolean } | null;
    controls: { met: number; notMet: number; toVerify: number };
    /** The control lines that fail or wait, by space: what changes under this edition. */
    open: { space: string; control: string; status: ControlStatus; section: string }[];
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
  const each = areaToSquareFeet(dec(String(area)), units).dividedBy(typeof rooms === 'string' || typeof rooms === 'number' ? dec(String(rooms)) : 1);
  if (satisfies(condition, each)) return key;
  const kind = type.sourceLabel.split('|')[0]!.trim();
  const sibling = to.spaceTypes.find((row) => {
    const other = sizeCondition(row.sourceLabel);
    return row.key !== key && row.sourceLabel.split('|')[0]!.trim() === kind && other?.quantity === 'area' && satisfies(other, each);
  });
  return sibling?.key ?? key;
}

export function compareEditions(document: EvaluationDocumentInput, from: EditionData, targets: readonly EditionData[]): EditionComparison[] {
  const all = [from, ...targets];
  const spaceEdges = equalities(all, 'space');
  const areaEdges = equalities(all, 'area');
  const units = document.units;
  return targets.map((to): EditionComparison => {
    const comparison: EditionComparison = { edition: to.id, title: to.title, status: 'evaluated', unmapped: [], remapped: [], controlsNotCarried: [], problems: [], result: null };
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
      for (const [field, kind] of [['spaceType', 'space'], ['controlSpaceType', 'space'], ['buildingAreaType', 'area']] as const) {
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
        if (fitted !== key && needed) comparison.remapped.push({ space: space.name, from: labelOf(from, kind, key), to: labelOf(to, kind, fitted) });
        copy[field] = fitted;
      }
      return copy;
    });
    const applications = new Set(to.exteriorApplications.map((application) => application.key));
    const exterior = document.exterior
      ? {
          ...document.exterior,
          applications: (document.exterior.applications ?? []).filter((application) => {
            if (applications.has(application.key)) return true;
            comparison.unmapped.push({ what: 'exterior application', name: from.exteriorApplications.find((row) => row.key === application.key)?.label ?? application.key, type: '' });
            return false;
          }).map((application) => ({ ...application, controls: carry(application.controls) })),
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
      ...(document.retailDisplay ? { retailDisplay: { claims: (document.retailDisplay.claims ?? []).filter((claim) => allowances.has(claim.allowance)) } } : {}),
      // A jurisdiction's amendments belong to the edition it amends.
      amendments: [],
    };
    const outcome = validateDocument(target, to);
    if (!outcome.valid) {
      comparison.status = 'not-valid';
      comparison.problems = outcome.problems;
      return comparison;
    }
    comparison.result = summary(evaluate(outcome.document, to));
    return comparison;
  });
}

/** What a comparison shows of one evaluation: the figures, and the control lines that fail or wait. */
export function summary(result: EvaluationResult): NonNullable<EditionComparison['result']> {
  const lines = result.interior.spaces.flatMap((space) => space.controls.map((line) => ({ space: space.name, line })));
  const exteriorLines = (result.exterior?.applications ?? []).flatMap((application) => application.controls.map((line) => ({ space: application.label, line })));
  const every = [...lines, ...exteriorLines];
  return {
    verdict: result.verdict,
    allowanceW: result.interior.allowanceW,
    installedW: result.interior.installedW,
    marginW: result.interior.marginW,
    marginPct: result.interior.marginPct,
    exterior: result.exterior ? { allowanceW: result.exterior.allowanceW, installedW: result.exterior.installedW, complies: result.exterior.complies } : null,
    controls: {
      met: every.filter(({ line }) => line.status === 'met' || line.status === 'exception-claimed').length,
      notMet: every.filter(({ line }) => line.status === 'not-met').length,
      toVerify: every.filter(({ line }) => line.status === 'to-verify').length,
    },
    open: every
      .filter(({ line }) => line.status === 'not-met' || line.status === 'to-verify')
      .map(({ space, line }) => ({ space, control: line.label, status: line.status, section: line.section })),
  };
}

function labelOf(edition: EditionData, kind: Kind, key: string): string {
  const rows = kind === 'space' ? edition.spaceTypes : edition.buildingAreaTypes;
  return rows.find((row) => row.key === key)?.label ?? key;
}
