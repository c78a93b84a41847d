import type { SpaceInput, SpaceRecord, SpaceResult, SpaceTypeView, UnitSystem } from '../../core/api/api-types';
import { formatDensity, formatPercent, formatWatts, unitLabels } from '../../shared/format';
import { metresPerFoot, squareMetresPerSquareFoot } from '../../shared/unit-words';

export const noLevel = 'No level';

export type SpaceRow =
  { kind: 'level'; id: string; level: string; count: number; area: number } | { kind: 'space'; id: string; space: SpaceRecord };

/**
 * Level headers and spaces in one flat list, so a single virtual scroll can carry thousands of rows.
 * Levels keep the order in which their first space was entered; spaces keep their position.
 */
export function groupByLevel(spaces: readonly SpaceRecord[]): SpaceRow[] {
  const levels = new Map<string, SpaceRecord[]>();
  for (const space of [...spaces].sort((a, b) => a.position - b.position)) {
    const level = space.level?.trim() || noLevel;
    let members = levels.get(level);
    if (!members) {
      members = [];
      levels.set(level, members);
    }
    members.push(space);
  }
  const rows: SpaceRow[] = [];
  for (const [level, members] of levels) {
    const area = members.reduce((sum, space) => sum + Number(space.area), 0);
    rows.push({ kind: 'level', id: `level:${level}`, level, count: members.length, area });
    for (const space of members) rows.push({ kind: 'space', id: space.id, space });
  }
  return rows;
}

/** A number and its unit stay on one line. */
function unbroken(text: string): string {
  return text.replace(' ', '\u00a0');
}

export type SpaceStatus =
  | { kind: 'updating' }
  | { kind: 'not-evaluated' }
  | { kind: 'none-entered' }
  | { kind: 'unlit' }
  | { kind: 'within'; words: string }
  | { kind: 'over'; words: string };

/**
 * A space's status in words; while results are updating no verdict is given, and a space without
 * luminaires has none until they are entered or it is confirmed unlit.
 */
export function spaceStatus(result: SpaceResult | undefined, resultsStatus: string): SpaceStatus {
  if (resultsStatus === 'updating' || resultsStatus === 'idle') return { kind: 'updating' };
  if (resultsStatus !== 'ready' || !result) return { kind: 'not-evaluated' };
  if (result.lighting === 'none-entered') return { kind: 'none-entered' };
  if (result.lighting === 'unlit') return { kind: 'unlit' };
  if (result.withinAllowance) {
    const pct = result.marginPct === null ? '' : `\u00a0(${formatPercent(result.marginPct).replace(' ', '\u00a0')})`;
    return { kind: 'within', words: `${unbroken(formatWatts(result.marginW))}${pct} to spare` };
  }
  return { kind: 'over', words: `by ${unbroken(formatWatts(String(-Number(result.marginW))))}` };
}

/** A table's W/ft² in the project's units (code tables hold IP densities). */
export function densityInUnits(lpdWPerFt2: string, units: UnitSystem): string {
  return units === 'ip' ? lpdWPerFt2 : String(Number(lpdWPerFt2) / squareMetresPerSquareFoot);
}

/**
 * A space type's allowance as people read it, in the project's units: a flat density, or, for a
 * row whose allowance grows with the room's height, so much per foot (metre) of height.
 */
export function spaceTypeAllowance(type: SpaceTypeView, units: UnitSystem): string {
  const formula = type.lpdFormula;
  if (!formula) return formatDensity(densityInUnits(type.lpdWPerFt2, units), units);
  // Per foot of height becomes per metre: 1 m = 1 / 0.3048 ft exactly (NIST SP 811).
  const perLength = units === 'ip' ? formula.wPerFt2PerFt : String(Number(densityInUnits(formula.wPerFt2PerFt, units)) / metresPerFoot);
  const perHeight = `${formatDensity(perLength, units)} per ${unitLabels(units).length} of height`;
  return formula.kind === 'per-foot-of-height'
    ? perHeight
    : `${formatDensity(densityInUnits(formula.baseWPerFt2, units), units)} + ${perHeight}`;
}

/** A stored space as the body of a write (what PUT and POST take back). */
export function spaceInput(space: SpaceRecord): SpaceInput {
  const { id: _id, position: _position, version: _version, updatedAt: _at, updatedBy: _by, luminaires, ...rest } = space;
  return { ...rest, luminaires: luminaires.map(({ luminaireTypeId: _type, ...group }) => group) };
}
