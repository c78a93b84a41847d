import { Decimal } from 'decimal.js';
import type { ControlStatus, EvaluationResult, SpaceResult, UnverifiedValue } from '../../../contract/result.js';
import { projectStateLabels, type ProjectState } from '../../../contract/review.js';
import type { RequirementCode, UnitSystem } from '../../../contract/editions.js';
import type { LuminaireType, ProvidedControl } from '../compliance/document.js';
import { dec } from '../compliance/numbers.js';

/**
 * What the Word package and the Excel workbook share: one order of the spaces, the words for
 * every coded value, and the display rounding of the web app (watts to 1 W, power densities to
 * 0.01, margins to 0.1 %, areas to 1 ft² or 0.1 m²), with thousands separators and the unit.
 */

// ---------------------------------------------------------------- order

const collator = new Intl.Collator('en-US', { numeric: true, sensitivity: 'base' });

/** Spaces by level (natural order: "Level 2" before "Level 10"; spaces with no level last), then by name. */
export function orderedSpaces(result: EvaluationResult): SpaceResult[] {
  return [...result.interior.spaces].sort(compareSpaces);
}

export function compareSpaces(a: Pick<SpaceResult, 'level' | 'name' | 'id'>, b: Pick<SpaceResult, 'level' | 'name' | 'id'>): number {
  if (a.level !== b.level) {
    if (a.level === null) return 1;
    if (b.level === null) return -1;
    const byLevel = collator.compare(a.level, b.level);
    if (byLevel !== 0) return byLevel;
  }
  return collator.compare(a.name, b.name) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}

export interface LevelGroup {
  /** The level's name; null for spaces given no level. */
  level: string | null;
  spaces: SpaceResult[];
}

/** The ordered spaces in runs of one level each. */
export function spacesByLevel(result: EvaluationResult): LevelGroup[] {
  const groups: LevelGroup[] = [];
  for (const space of orderedSpaces(result)) {
    const last = groups.at(-1);
    if (last && last.level === space.level) last.spaces.push(space);
    else groups.push({ level: space.level, spaces: [space] });
  }
  return groups;
}

export function levelWords(level: string | null): string {
  return level ?? 'No level given';
}

// ---------------------------------------------------------------- numbers

function rounded(value: string, places: number): string {
  const fixed = dec(value).toDecimalPlaces(places, Decimal.ROUND_HALF_UP).toFixed(places);
  const unsigned = /^-0(\.0*)?$/.test(fixed) ? fixed.slice(1) : fixed;
  const [whole, fraction] = unsigned.split('.') as [string, string | undefined];
  const sign = whole.startsWith('-') ? '-' : '';
  const digits = sign ? whole.slice(1) : whole;
  const grouped = digits.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${sign}${grouped}${fraction === undefined ? '' : `.${fraction}`}`;
}

/** Up to `places` decimals, trailing zeros dropped (as Intl's maximumFractionDigits does). */
function upTo(value: string, places: number): string {
  const text = rounded(value, places);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

export interface UnitWords {
  length: string;
  area: string;
  density: string;
}

export function unitWords(units: UnitSystem): UnitWords {
  return units === 'ip' ? { length: 'ft', area: 'ft²', density: 'W/ft²' } : { length: 'm', area: 'm²', density: 'W/m²' };
}

export const figures = {
  watts: (value: string) => rounded(value, 0),
  density: (value: string) => rounded(value, 2),
  percent: (value: string | null) => (value === null ? '—' : rounded(value, 1)),
  area: (value: string, units: UnitSystem) => (units === 'ip' ? rounded(value, 0) : upTo(value, 1)),
  /** The rated input of one luminaire, to 0.1 W as schedules give it. */
  rated: (value: string) => rounded(value, 1),
  quantity: (value: string) => upTo(value, 2),
  rate: (value: string) => upTo(value, 3),
  length: (value: string) => upTo(value, 2),
};

export const withUnits = {
  watts: (value: string) => `${figures.watts(value)} W`,
  density: (value: string, units: UnitSystem) => `${figures.density(value)} ${unitWords(units).density}`,
  percent: (value: string | null) => (value === null ? '—' : `${figures.percent(value)} %`),
  area: (value: string, units: UnitSystem) => `${figures.area(value, units)} ${unitWords(units).area}`,
  length: (value: string, units: UnitSystem) => `${figures.length(value)} ${unitWords(units).length}`,
};

/** A margin in words: what is left, or the excess. */
export function marginWords(marginW: string, marginPct: string | null = null): string {
  const margin = dec(marginW);
  const amount = withUnits.watts(margin.abs().toString());
  if (margin.isNegative() && !margin.isZero()) return `${amount} over`;
  return marginPct === null ? `${amount} to spare` : `${amount} (${withUnits.percent(marginPct)}) to spare`;
}

// ---------------------------------------------------------------- words

const editionNames: Record<string, string> = {
  'iecc-2018': 'IECC 2018',
  'iecc-2021': 'IECC 2021',
  'iecc-2024': 'IECC 2024',
  'ashrae-90.1-2013': 'ASHRAE 90.1-2013',
  'ashrae-90.1-2016': 'ASHRAE 90.1-2016',
  'ashrae-90.1-2019': 'ASHRAE 90.1-2019',
  'ashrae-90.1-2022': 'ASHRAE 90.1-2022',
};

export function editionWords(edition: string | null): string {
  if (edition === null) return 'Not chosen';
  return editionNames[edition] ?? edition;
}

export function methodWords(method: string | null): string {
  if (method === 'space-by-space') return 'Space-by-space method';
  if (method === 'building-area') return 'Building area method';
  return 'Not chosen';
}

export function unitSystemWords(units: UnitSystem): string {
  return units === 'ip' ? 'Inch-pound (ft², W/ft²)' : 'SI (m², W/m²)';
}

export function stateWords(state: string): string {
  return projectStateLabels[state as ProjectState] ?? 'Unknown state';
}

export function verdictWords(verdict: EvaluationResult['verdict']): string {
  switch (verdict) {
    case 'complies':
      return 'Complies';
    case 'does-not-comply':
      return 'Does not comply';
    case 'incomplete':
      return 'Incomplete: open items remain';
  }
}

export function withinWords(within: boolean): string {
  return within ? 'Within allowance' : 'Over allowance';
}

/** A space's power status: no verdict until its lighting is entered or it is confirmed unlit. */
export function spaceStatusWords(space: Pick<SpaceResult, 'lighting' | 'withinAllowance'>): string {
  if (space.lighting === 'none-entered') return 'No luminaires entered';
  if (space.lighting === 'unlit') return 'Unlit (confirmed)';
  return withinWords(space.withinAllowance);
}

const controlStatusNames: Record<ControlStatus, string> = {
  met: 'Met',
  'not-met': 'Not met',
  'exception-claimed': 'Exception claimed',
  'to-verify': 'To verify',
  'not-required': 'Not required',
};

export function controlStatusWords(status: ControlStatus): string {
  return controlStatusNames[status];
}

export function requirementWords(requirement: RequirementCode): string {
  if (requirement === 'required') return 'Required';
  if (requirement === 'not-required') return 'Not required';
  if (requirement === 'to-verify') return 'Requirement to verify';
  return `At least one of group ${requirement.slice('one-of:'.length)}`;
}

const useNames: Record<LuminaireType['use'], string> = {
  general: 'General lighting',
  decorative: 'Decorative',
  display: 'Display',
  exempt: 'Exempt',
};

export function useWords(use: LuminaireType['use']): string {
  return useNames[use];
}

const basisNames: Record<LuminaireType['basis'], string> = {
  rated: 'Rated input watts',
  'line-voltage-track': 'Line-voltage track (by length or limiter)',
  'low-voltage-track': 'Low-voltage track (transformer rating)',
  'current-limited': 'Current-limited circuit (limiter rating)',
};

export function basisWords(basis: LuminaireType['basis']): string {
  return basisNames[basis];
}

const zoneNames: Record<string, string> = {
  'primary-sidelit': 'Primary sidelit',
  'secondary-sidelit': 'Secondary sidelit',
  toplit: 'Toplit',
};

export function zoneWords(kind: string): string {
  return zoneNames[kind] ?? 'Daylight zone';
}

const exceptionNames: Record<NonNullable<ProvidedControl['exceptionReason']>, string> = {
  'security-or-emergency-continuous': 'Security or emergency area that must stay lit continuously',
  'exit-stairway-ramp-passageway': 'Interior exit stairway, exit ramp or exit passageway',
  'egress-normally-off': 'Emergency egress lighting that is normally off',
  'continuous-operation': 'Lighting intended to operate continuously',
  'verified-not-required': 'Checked against the adopted code: not required here',
  other: 'Another exception',
};

/** What the design provides for one requirement, in words: the device and its time-out, or the exception claimed. */
export function providedWords(control: ProvidedControl | undefined): string {
  if (control === undefined) return 'Nothing recorded';
  if (control.exceptionReason !== undefined) {
    const note = control.exceptionNote ? `: ${control.exceptionNote}` : '';
    return `Exception: ${exceptionNames[control.exceptionReason]}${note}`;
  }
  if (!control.provided) return 'Not provided';
  const parts = [control.device ?? 'Provided (no device named)'];
  if (control.timeoutMinutes !== undefined) parts.push(`time-out ${figures.quantity(control.timeoutMinutes)} min`);
  if (control.reductionPercent !== undefined) parts.push(`reduces by ${figures.quantity(control.reductionPercent)} %`);
  if (control.autoOn === 'manual') parts.push('manual on');
  if (control.autoOn === 'partial') parts.push('automatic on to at most half');
  if (control.autoOn === 'full') parts.push('automatic on');
  return parts.join(', ');
}

const layerNames: Record<UnverifiedValue['citation']['layer'], string> = {
  'model-code': 'Model code text, not yet checked against the printed edition',
  'other-edition-or-state': 'Another edition or a state code standing in',
  'modelling-dataset': 'A public modelling data set’s reading of the rule',
  'not-checked': 'Not checked against any published source',
};

/** How far a value can be trusted, in words. */
export function confidenceWords(value: UnverifiedValue): string {
  return value.citation.checked ? 'Checked against its source' : layerNames[value.citation.layer];
}

/** Where a value comes from, in words: its citation, and the source where it says more. */
export function citedWords(value: UnverifiedValue): string {
  const source = value.source.trim();
  return source === '' || source === value.citation.short || value.citation.short.includes(source)
    ? value.citation.short
    : `${value.citation.short}. ${source}`;
}

/** The value's notes, each said once. */
export function noteWords(value: UnverifiedValue): string {
  const notes: string[] = [];
  for (const note of [value.citation.note, value.note]) {
    const text = note?.trim() ?? '';
    if (text !== '' && !notes.some((kept) => kept.includes(text))) notes.push(text);
  }
  return notes.join(' ');
}

/** Exterior quantities: ft² or m², linear ft or m, or a count, as the application's unit says. */
export function quantityUnit(rateUnit: string): string {
  const per = /^W\/(.+)$/.exec(rateUnit.trim());
  return per ? per[1]! : rateUnit;
}

// ---------------------------------------------------------------- cautions

/**
 * The standing cautions of every package (the result's own come after them): the same three the
 * results carry (`standingCautions` in the evaluation), so the wording is one.
 */
export function packageCautions(result: EvaluationResult): string[] {
  return [...new Set(result.cautions)];
}

/** A date as people write it, on the project's own calendar (UTC where the project has no time zone). */
export function dateWords(iso: string, timeZone: string | null = null): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const options: Intl.DateTimeFormatOptions = { year: 'numeric', month: 'long', day: 'numeric' };
  try {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone: timeZone ?? 'UTC' }).format(date);
  } catch {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone: 'UTC' }).format(date);
  }
}
