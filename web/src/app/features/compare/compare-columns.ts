import type {
  ComparisonSummary,
  ControlChange,
  ControlStatus,
  EditionComparison,
  ProjectComparison,
  UnitSystem,
} from '../../core/api/api-types';
import { editionLabel } from '../../shared/edition-labels';
import { formatArea, formatDensity, formatPercent, formatWatts } from '../../shared/format';
import { problemLine, type ProblemLine } from '../../shared/problem-words';
import { inProjectUnits } from '../../shared/unit-words';
import { statusView } from '../controls/control-status';

/** A power status never shown by colour alone: an icon and the words. */
export interface PowerStatus {
  within: boolean;
  icon: 'check_circle' | 'warning';
  label: 'Within allowance' | 'Over allowance';
}

export interface PowerFigures {
  allowance: string;
  installed: string;
  /** allowance − installed as a figure (negative: the excess), with its share of the allowance where known. */
  margin: string;
  /** The same margin in words: what is left, or the excess. */
  marginWords: string;
  status: PowerStatus;
}

export interface InteriorFigures extends PowerFigures {
  area: string;
  allowanceDensity: string;
  installedDensity: string;
}

export interface ExteriorFigures extends PowerFigures {
  /** The design's applications this edition does not list: their watts are not in these figures. */
  notCounted: string[];
}

export type ChangeKind = 'now-required' | 'to-verify' | 'no-longer-required' | 'settled-not-required';

export interface ChangeItem {
  control: string;
  /** The spaces (and exterior applications) it changes for, in words. */
  places: string;
  /** For a control that becomes required: whether the design meets it there ("not met", "2 not met, 1 met"). */
  statuses: string;
}

export interface ChangeGroup {
  kind: ChangeKind;
  heading: string;
  items: ChangeItem[];
}

export interface ColumnControls {
  /** Met, not met and to verify, in words. */
  counts: string;
  /** Controls recorded under the project's edition that this one does not have. */
  notCarried: string | null;
  /** Against the project's own edition; empty for the own edition itself. */
  changes: ChangeGroup[];
  /** What to say where there is no change to list. */
  unchanged: string | null;
}

export interface EditionColumn {
  edition: string;
  /** The edition's short name ("90.1-2019") and its full title. */
  label: string;
  title: string;
  /** The project's own edition, shown first. */
  own: boolean;
  evaluated: boolean;
  verdict: { icon: string; words: string; detail: string };
  interior: InteriorFigures | null;
  exterior: ExteriorFigures | null;
  /** How the spaces' types map onto this edition, in words. */
  mapping: string;
  /** Each space without a matching row: its name and its type's title. */
  unmapped: string[];
  controls: ColumnControls | null;
  unverified: { count: number; words: string; note: string } | null;
  /** Why a mapped design does not fit this edition, each in words with the page where it is fixed. */
  problems: ProblemLine[];
}

/** What the columns need of the project: its spaces (in the document's order), luminaire tags and units. */
export interface CompareContext {
  spaces: readonly { id: string; name: string }[];
  luminaireTags: readonly string[];
  units: UnitSystem;
}

export interface CompareView {
  ownLabel: string;
  units: UnitSystem;
  /** Whether the design has exterior lighting: its figures are shown only then. */
  hasExterior: boolean;
  columns: EditionColumn[];
}

const plural = (count: number, one: string, many = `${one}s`) => `${count} ${count === 1 ? one : many}`;

function powerStatus(within: boolean): PowerStatus {
  return within ? { within, icon: 'check_circle', label: 'Within allowance' } : { within, icon: 'warning', label: 'Over allowance' };
}

function marginFigure(marginW: string, marginPct: string | null = null): string {
  return marginPct === null ? formatWatts(marginW) : `${formatWatts(marginW)} (${formatPercent(marginPct)})`;
}

/** The margin in words, from the same figure the margin shows: "within allowance, 1,741 W to spare" or "over by 200 W". */
export function marginWords(within: boolean, marginW: string): string {
  const amount = formatWatts(String(Math.abs(Number(marginW))));
  return within ? `within allowance, ${amount} to spare` : `over by ${amount}`;
}

function interiorFigures(result: ComparisonSummary): InteriorFigures {
  return {
    allowance: formatWatts(result.allowanceW),
    installed: formatWatts(result.installedW),
    margin: marginFigure(result.marginW, result.marginPct),
    marginWords: marginWords(result.interiorComplies, result.marginW),
    status: powerStatus(result.interiorComplies),
    area: formatArea(result.area, result.units),
    allowanceDensity: formatDensity(result.allowanceLpd, result.units),
    installedDensity: formatDensity(result.installedLpd, result.units),
  };
}

function exteriorFigures(exterior: NonNullable<ComparisonSummary['exterior']>, notCounted: string[]): ExteriorFigures {
  // The site's total can leave watts to spare while one nontradable application is over its own
  // allowance, which nothing else may cover: the words say so rather than "over by 0 W".
  const words =
    !exterior.complies && Number(exterior.marginW) >= 0
      ? 'over: an application is over its own allowance'
      : marginWords(exterior.complies, exterior.marginW);
  return {
    allowance: formatWatts(exterior.allowanceW),
    installed: formatWatts(exterior.installedW),
    margin: marginFigure(exterior.marginW),
    marginWords: words,
    status: powerStatus(exterior.complies),
    notCounted,
  };
}

function verdictOf(comparison: EditionComparison): EditionColumn['verdict'] {
  const result = comparison.result;
  if (comparison.status === 'not-mapped' || result === null) {
    const spaces = comparison.unmapped.filter((entry) => entry.what === 'space').length;
    return comparison.status === 'not-mapped'
      ? {
          icon: 'block',
          words: 'Not evaluated',
          detail: `${plural(spaces, 'space has', 'spaces have')} no matching space type in this edition`,
        }
      : { icon: 'block', words: 'Not evaluated', detail: 'the design does not fit this edition’s tables; the problems are listed below' };
  }
  if (result.verdict === 'complies') return { icon: 'check_circle', words: 'Complies', detail: '' };
  if (result.verdict === 'incomplete') {
    const waiting =
      result.controls.toVerify > 0
        ? `${plural(result.controls.toVerify, 'control requirement')} to verify`
        : 'a space has no luminaires entered';
    return { icon: 'edit_note', words: 'Design incomplete', detail: `no verdict yet: ${waiting}` };
  }
  const reasons = [
    result.interiorComplies ? '' : 'interior power over allowance',
    result.exterior && !result.exterior.complies ? 'exterior power over allowance' : '',
    result.controls.notMet > 0 ? `${plural(result.controls.notMet, 'control requirement')} not met` : '',
  ].filter(Boolean);
  return { icon: 'warning', words: 'Does not comply', detail: reasons.join('; ') };
}

/** Names a change lists before it counts the rest: a large project's list would bury the column. */
export const namedPlaces = 40;

/**
 * The spaces a change applies to, in words: every space, every space but a few, or each by name
 * (the first {@link namedPlaces}, then how many more); exterior applications after.
 */
export function placesWords(places: readonly { place: string; exterior: boolean }[], spaceNames: readonly string[]): string {
  const spaces = places.filter((entry) => !entry.exterior).map((entry) => entry.place);
  const exterior = places.filter((entry) => entry.exterior).map((entry) => `${entry.place} (exterior)`);
  const listed = new Set(spaces);
  const others = spaceNames.filter((name) => !listed.has(name));
  let words = '';
  if (spaces.length === 1) words = spaces[0]!;
  else if (spaces.length > 1 && others.length === 0 && spaces.length === spaceNames.length) words = `all ${spaces.length} spaces`;
  else if (spaces.length > 1 && others.length <= 3 && others.length < spaces.length)
    words = `${spaces.length} spaces: all but ${others.join(', ')}`;
  else if (spaces.length > namedPlaces)
    words = `${spaces.length} spaces: ${spaces.slice(0, namedPlaces).join(', ')} and ${spaces.length - namedPlaces} more`;
  else if (spaces.length > 1) words = `${spaces.length} spaces: ${spaces.join(', ')}`;
  return [words, ...exterior].filter(Boolean).join('; ');
}

function statusWords(statuses: readonly ControlStatus[]): string {
  const counts = new Map<ControlStatus, number>();
  for (const status of statuses) counts.set(status, (counts.get(status) ?? 0) + 1);
  const words = (status: ControlStatus) => statusView(status).words.toLocaleLowerCase();
  if (counts.size === 1) return words(statuses[0]!);
  return [...counts].map(([status, count]) => `${count} ${words(status)}`).join(', ');
}

function changeKind(change: ControlChange['changes'][number]): ChangeKind {
  if (change.requirement === 'required') return 'now-required';
  if (change.requirement === 'to-verify') return 'to-verify';
  return change.before === 'to-verify' ? 'settled-not-required' : 'no-longer-required';
}

const kindOrder: readonly ChangeKind[] = ['now-required', 'to-verify', 'no-longer-required', 'settled-not-required'];

/**
 * The controls whose requirement changes against the project's own edition, one line per control
 * and kind of change, naming every space it changes for (a control is listed by what it becomes,
 * so a requirement the tables cannot settle reads "to verify", never "not required").
 */
export function changeGroups(controlChanges: readonly ControlChange[], ownLabel: string, spaceNames: readonly string[]): ChangeGroup[] {
  const headings: Record<ChangeKind, string> = {
    'now-required': 'Becomes required',
    'to-verify': 'Requirement to verify (the tables do not settle it)',
    'no-longer-required': 'No longer required',
    'settled-not-required': `Not required (to verify under ${ownLabel})`,
  };
  const byKind = new Map<ChangeKind, Map<string, { places: { place: string; exterior: boolean }[]; statuses: ControlStatus[] }>>();
  for (const { place, exterior, changes } of controlChanges) {
    for (const change of changes) {
      const kind = changeKind(change);
      const controls = byKind.get(kind) ?? new Map();
      byKind.set(kind, controls);
      const entry = controls.get(change.control) ?? { places: [], statuses: [] };
      controls.set(change.control, entry);
      entry.places.push({ place, exterior });
      entry.statuses.push(change.status);
    }
  }
  return kindOrder
    .filter((kind) => byKind.has(kind))
    .map((kind) => ({
      kind,
      heading: headings[kind],
      items: [...byKind.get(kind)!].map(([control, entry]) => ({
        control,
        places: placesWords(entry.places, spaceNames),
        statuses: kind === 'now-required' ? statusWords(entry.statuses) : '',
      })),
    }));
}

function column(comparison: EditionComparison, own: boolean, ownLabel: string, units: UnitSystem, context: CompareContext): EditionColumn {
  const result = comparison.result;
  const spaceNames = context.spaces.map((space) => space.name);
  const inUnits = (text: string) => inProjectUnits(text, units);
  const unmapped = comparison.unmapped.filter((entry) => entry.what === 'space').map((entry) => `${entry.name}: ${inUnits(entry.type)}`);
  const exteriorNotCounted = comparison.unmapped
    .filter((entry) => entry.what === 'exterior application')
    .map((entry) => inUnits(entry.name));
  const remapped = comparison.remapped.length;
  const mapping = own
    ? 'The project’s own space types.'
    : unmapped.length > 0
      ? `${plural(unmapped.length, 'space has', 'spaces have')} no matching space type in this edition:`
      : `Every space maps to a space type of this edition${remapped > 0 ? `; ${plural(remapped, 'space takes a row', 'spaces take a row')} of another name` : ''}.`;
  const changes = own ? [] : changeGroups(comparison.controlChanges, ownLabel, spaceNames);
  const unverified = result?.unverifiedValues ?? 0;
  return {
    edition: comparison.edition,
    label: editionLabel(comparison.edition, comparison.title),
    title: comparison.title,
    own,
    evaluated: result !== null,
    verdict: verdictOf(comparison),
    interior: result ? interiorFigures(result) : null,
    exterior: result?.exterior ? exteriorFigures(result.exterior, exteriorNotCounted) : null,
    mapping,
    unmapped,
    controls: result
      ? {
          counts: `${result.controls.met} met · ${result.controls.notMet} not met · ${result.controls.toVerify} to verify`,
          notCarried:
            comparison.controlsNotCarried.length > 0
              ? `Recorded under ${ownLabel}, not in this edition: ${comparison.controlsNotCarried.join(', ')}.`
              : null,
          changes,
          unchanged: own
            ? 'The requirements the other editions are set against.'
            : changes.length === 0
              ? `Every requirement as under ${ownLabel}.`
              : null,
        }
      : null,
    unverified: result
      ? {
          count: unverified,
          words:
            unverified === 0 ? 'None: every value used comes from a verified published source' : `${plural(unverified, 'value')} to verify`,
          note: `${plural(unverified, 'value')} this evaluation used ${unverified === 1 ? 'rests' : 'rest'} on a source not yet confirmed against the printed code${own ? '; the Results page names each one' : ''}.`,
        }
      : null,
    problems: comparison.problems.map((problem) => problemLine(problem, { spaces: context.spaces, luminaireTags: context.luminaireTags })),
  };
}

/**
 * The comparison as columns: the project's own edition first (marked), then every other edition
 * as the service lists them, each with its figures and words in the project's units. The project's
 * spaces let a change for nearly all of them say "all but …".
 */
export function compareView(comparison: ProjectComparison, context: CompareContext): CompareView {
  const units = comparison.current.result?.units ?? context.units;
  const ownLabel = editionLabel(comparison.current.edition, comparison.current.title);
  return {
    ownLabel,
    units,
    hasExterior: comparison.current.result?.exterior != null || comparison.editions.some((edition) => edition.result?.exterior != null),
    columns: [
      column(comparison.current, true, ownLabel, units, context),
      ...comparison.editions.map((edition) => column(edition, false, ownLabel, units, context)),
    ],
  };
}
