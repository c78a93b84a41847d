import { createHash } from 'node:crypto';
import { Decimal } from 'decimal.js';
import { reviewItemKindLabels, type ReviewItemKind, type ReviewOutcome, type ReviewValue } from '../../../contract/review.js';
import type { EditionId, StrategyKey } from '../../../contract/editions.js';
import type { ControlLine, EvaluationResult, ExteriorResult, SpaceResult } from '../../../contract/result.js';
import { editionName } from '../compliance/citation.js';
import type { EvaluationDocumentInput } from '../compliance/document.js';
import { dec } from '../compliance/numbers.js';

/**
 * The reviewer's check items of one round, generated from the evaluation the submission froze.
 * Pure: it reads nothing but the document and the result. Per space, one item for each control
 * area the engine's result assesses (its own control lines, so an edition that asks nothing of a
 * space gets no item for it) and one for the power allowance; for the site, its power and its
 * controls when the project has exterior lighting. Each carries the engine's reasoning in words,
 * the figures it used with their units, the section cited and the engine's outcome.
 */
export interface CheckItem {
  /** The kind and the space's id (`site` for the exterior): stable from round to round. */
  key: string;
  kind: ReviewItemKind;
  spaceId: string | null;
  title: string;
  section: string;
  outcome: ReviewOutcome;
  reasoning: string;
  values: ReviewValue[];
  /** What the item rests on: the space's (or the site's) entered data and what the engine made of it. */
  fingerprint: string;
}

/** Which strategies each control item covers; every interior strategy belongs to one, so no line the engine assessed goes unreviewed. */
export const strategiesByKind: Partial<Record<ReviewItemKind, readonly (StrategyKey | 'control-space-type')[]>> = {
  'occupancy-sensing': ['occupant-sensor', 'restricted-manual-on', 'restricted-partial-auto-on'],
  'automatic-shutoff': ['automatic-partial-off', 'automatic-full-off', 'scheduled-shutoff', 'time-switch'],
  'daylight-response': ['daylight-sidelighting', 'daylight-toplighting', 'parking-daylight-transition'],
  'light-reduction': ['bilevel', 'light-reduction'],
  'other-controls': ['local-control', 'specific-application'],
};

const spaceControlKinds = ['occupancy-sensing', 'automatic-shutoff', 'daylight-response', 'light-reduction', 'other-controls'] as const;

const statusWords: Record<ControlLine['status'], string> = {
  met: 'Met',
  'not-met': 'Not met',
  'exception-claimed': 'Exception claimed',
  'to-verify': 'To verify',
  'not-required': 'Not required',
};

const uncheckedRule = 'The edition’s rule behind this is not yet checked against the printed code.';

export function checkItems(document: EvaluationDocumentInput, result: EvaluationResult): CheckItem[] {
  const edition = editionTitle(result.edition);
  const units = unitWords(result.units);
  const types = new Map(document.luminaireTypes?.map((type) => [type.tag, type]) ?? []);
  const entered = new Map(document.spaces.map((space) => [space.id, space]));
  const items: CheckItem[] = [];

  for (const space of result.interior.spaces) {
    const input = entered.get(space.id);
    const basis = {
      space: input ?? null,
      types: (input?.luminaires ?? []).map((group) => types.get(group.tag) ?? null),
      claims: (document.retailDisplay?.claims ?? []).filter((claim) => claim.spaceId === space.id),
    };
    items.push(withFingerprint(powerItem(space, result, edition, units), basis));
    // A space without a control space type has no control rules to apply: every control area waits for it.
    const unset = space.controls.filter((line) => line.strategy === 'control-space-type');
    for (const kind of spaceControlKinds) {
      const strategies = strategiesByKind[kind]!;
      const lines = [
        ...unset,
        ...space.controls.filter((line) => line.strategy !== 'control-space-type' && strategies.includes(line.strategy)),
      ];
      if (lines.length === 0) continue;
      const item = controlItem(kind, space.id, `${space.name}: ${reviewItemKindLabels[kind]}`, lines, edition);
      item.values.unshift({ label: 'Floor area', value: `${figure(space.area, units.areaPlaces)} ${units.area}` });
      if (kind === 'daylight-response') item.values.push(...daylightValues(space, units));
      if (kind === 'light-reduction')
        item.values.push(
          { label: 'Installed', value: `${figure(space.installedW, 0)} W` },
          { label: 'Installed density', value: `${figure(space.installedLpd, 2, true)} ${units.density}` },
        );
      items.push(withFingerprint(item, basis));
    }
  }

  const exterior = result.exterior;
  if (exterior && exterior.applications.length > 0) {
    const basis = { exterior: document.exterior ?? null };
    items.push(withFingerprint(exteriorPowerItem(exterior, edition), basis));
    const lines = exterior.applications.flatMap((application) =>
      application.controls.map((line) => ({ ...line, label: `${application.label}: ${line.label}` })),
    );
    if (lines.length > 0) {
      items.push(
        withFingerprint(
          controlItem('exterior-controls', null, `Site: ${reviewItemKindLabels['exterior-controls']}`, lines, edition),
          basis,
        ),
      );
    }
  }
  return items;
}

// ---------------------------------------------------------------- interior power

function powerItem(
  space: SpaceResult,
  result: EvaluationResult,
  edition: string,
  units: UnitWords,
): Omit<CheckItem, 'fingerprint'> & { ownWords: string } {
  const values: ReviewValue[] = [
    { label: space.lpdBasis.kind === 'space-type' ? 'Space type' : 'Building area type', value: space.lpdBasis.label },
    { label: 'Floor area', value: `${figure(space.area, units.areaPlaces)} ${units.area}` },
    { label: 'Allowed density', value: `${figure(space.allowedLpd, 2, true)} ${units.density}` },
    { label: 'Allowance', value: `${figure(space.allowanceW, 0)} W` },
    { label: 'Installed', value: `${figure(space.installedW, 0)} W` },
    { label: 'Installed density', value: `${figure(space.installedLpd, 2, true)} ${units.density}` },
    { label: 'Margin', value: `${figure(space.marginW, 0)} W${space.marginPct === null ? '' : ` (${figure(space.marginPct, 1)} %)`}` },
  ];
  if (dec(space.additionalAllowanceW).greaterThan(0))
    values.push({ label: 'Additional allowance used', value: `${figure(space.additionalAllowanceW, 0)} W` });
  if (dec(space.exemptW).greaterThan(0)) values.push({ label: 'Exempt, not counted', value: `${figure(space.exemptW, 0)} W` });
  if (space.roomGeometryIncreaseApplied) values.push({ label: 'Room geometry increase', value: 'Applied' });

  const allowance = `${figure(space.allowanceW, 0)} W (${figure(space.allowedLpd, 2, true)} ${units.density} for ${space.lpdBasis.label} over ${figure(space.area, units.areaPlaces)} ${units.area}${
    dec(space.additionalAllowanceW).greaterThan(0) ? `, with ${figure(space.additionalAllowanceW, 0)} W of additional allowance` : ''
  })`;
  let outcome: ReviewOutcome;
  let reasoning: string;
  let ownWords: string | undefined;
  if (space.lighting === 'unlit') {
    outcome = 'not-required';
    reasoning = 'The space is confirmed unlit, so it has no lighted floor area and adds nothing to the building’s allowance.';
  } else if (space.lighting === 'none-entered') {
    outcome = 'to-verify';
    reasoning = `No luminaires are entered and the space is not confirmed unlit, so its lighting cannot be checked yet. Its allowance is ${allowance}.`;
  } else if (space.withinAllowance) {
    outcome = 'met';
    reasoning = `Installed ${figure(space.installedW, 0)} W is within the allowance of ${allowance}, a margin of ${figure(space.marginW, 0)} W.`;
  } else {
    const over = `Installed ${figure(space.installedW, 0)} W is more than the space’s allowance of ${allowance}, by ${figure(dec(space.marginW).negated().toString(), 0)} W`;
    ownWords = over;
    if (result.interior.complies) {
      outcome = 'met';
      reasoning = `${over}; the building’s total allowance of ${figure(result.interior.allowanceW, 0)} W covers it (installed ${figure(result.interior.installedW, 0)} W in all), and the total is what the code limits.`;
    } else {
      outcome = 'not-met';
      reasoning = `${over}, and the building’s total of ${figure(result.interior.installedW, 0)} W is more than its allowance of ${figure(result.interior.allowanceW, 0)} W.`;
    }
  }
  return {
    key: `power-allowance:${space.id}`,
    kind: 'power-allowance',
    spaceId: space.id,
    title: `${space.name}: ${reviewItemKindLabels['power-allowance']}`,
    section: cited(edition, [space.section]),
    outcome,
    reasoning,
    values,
    ownWords: ownWords ?? reasoning,
  };
}

// ---------------------------------------------------------------- controls

function controlItem(
  kind: ReviewItemKind,
  spaceId: string | null,
  title: string,
  lines: readonly ControlLine[],
  edition: string,
): Omit<CheckItem, 'fingerprint'> {
  const reasons = lines.length === 1 ? [lines[0]!.reason] : lines.map((line) => `${line.label}: ${line.reason}`);
  if (lines.some((line) => !line.verified && line.status !== 'not-required')) reasons.push(uncheckedRule);
  return {
    key: `${kind}:${spaceId ?? 'site'}`,
    kind,
    spaceId,
    title,
    section: cited(
      edition,
      lines.map((line) => line.section),
    ),
    outcome: controlOutcome(lines),
    reasoning: reasons.join(' '),
    values: lines.map((line) => ({ label: line.label, value: statusWords[line.status] })),
  };
}

/**
 * One outcome for the lines of an item: any unmet line makes it not met; a claimed exception is
 * the reviewer's to verify, as is a line the engine left open; met when a line is met; not
 * required only when none is.
 */
export function controlOutcome(lines: readonly Pick<ControlLine, 'status'>[]): ReviewOutcome {
  if (lines.some((line) => line.status === 'not-met')) return 'not-met';
  if (lines.some((line) => line.status === 'to-verify' || line.status === 'exception-claimed')) return 'to-verify';
  if (lines.some((line) => line.status === 'met')) return 'met';
  return 'not-required';
}

function daylightValues(space: SpaceResult, units: UnitWords): ReviewValue[] {
  const daylight = space.daylight;
  if (!daylight.geometryEvaluated) return [{ label: 'Daylight zones', value: 'Not drawn: the room has no length and width' }];
  return [
    { label: 'Window area', value: `${figure(daylight.windowArea, units.areaPlaces)} ${units.area}` },
    {
      label: 'Primary sidelit zone',
      value: `${figure(daylight.primarySidelitArea, units.areaPlaces)} ${units.area}, ${figure(daylight.primarySidelitW, 0)} W`,
    },
    {
      label: 'Secondary sidelit zone',
      value: `${figure(daylight.secondarySidelitArea, units.areaPlaces)} ${units.area}, ${figure(daylight.secondarySidelitW, 0)} W`,
    },
    { label: 'Toplit zone', value: `${figure(daylight.toplitArea, units.areaPlaces)} ${units.area}, ${figure(daylight.toplitW, 0)} W` },
  ];
}

// ---------------------------------------------------------------- exterior power

function exteriorPowerItem(exterior: ExteriorResult, edition: string): Omit<CheckItem, 'fingerprint'> {
  const values: ReviewValue[] = [
    { label: 'Lighting zone', value: exterior.lightingZone },
    { label: 'Base site allowance', value: `${figure(exterior.baseSiteAllowanceW, 0)} W` },
    { label: 'Allowance', value: `${figure(exterior.allowanceW, 0)} W` },
    { label: 'Installed', value: `${figure(exterior.installedW, 0)} W` },
  ];
  if (dec(exterior.exemptW).greaterThan(0)) values.push({ label: 'Exempt, not counted', value: `${figure(exterior.exemptW, 0)} W` });
  for (const application of exterior.applications) {
    values.push({
      label: application.label,
      value: `${figure(application.installedW, 0)} W of ${figure(application.allowanceW, 0)} W (${figure(application.quantity, 2)}${quantityUnit(application.unit, application.quantity)} at ${figure(application.rate, 3)} ${application.unit}${application.tradable ? '' : ', not tradable'})`,
    });
  }
  const tradable = exterior.tradable;
  const parts = [
    `Tradable applications: installed ${figure(tradable.installedW, 0)} W against ${figure(tradable.allowanceW, 0)} W${
      dec(tradable.baseSiteUsedW).greaterThan(0) ? `, using ${figure(tradable.baseSiteUsedW, 0)} W of the base site allowance` : ''
    }; ${tradable.complies ? 'within' : 'over'} the allowance.`,
  ];
  const nontradable = exterior.applications.filter((application) => !application.tradable);
  for (const application of nontradable) {
    parts.push(
      `${application.label}, not tradable: installed ${figure(application.installedW, 0)} W against ${figure(application.allowanceW, 0)} W${
        dec(application.baseSiteUsedW).greaterThan(0) ? `, using ${figure(application.baseSiteUsedW, 0)} W of the base site allowance` : ''
      }; ${application.withinAllowance ? 'within' : 'over'} its allowance.`,
    );
  }
  for (const application of exterior.applications.filter((line) => line.exemption)) {
    parts.push(
      `${application.label}: ${figure(application.exemptW, 0)} W exempt as ${application.exemption!.label.toLowerCase()}, to verify against the adopted code.`,
    );
  }
  const exempt = exterior.applications.some((line) => line.exemption);
  return {
    key: 'exterior-power:site',
    kind: 'exterior-power',
    spaceId: null,
    title: `Site: ${reviewItemKindLabels['exterior-power']}`,
    section: cited(edition, [exterior.section]),
    outcome: !exterior.complies ? 'not-met' : exempt ? 'to-verify' : 'met',
    reasoning: parts.join(' '),
    values,
  };
}

// ---------------------------------------------------------------- words and figures

/**
 * The print of the item as generated and of the data it rests on. A power allowance's words also
 * quote the building's totals, which every change anywhere moves: they are left out (`ownWords`),
 * so only the space's own change, or a change of outcome, marks it changed.
 */
function withFingerprint(item: Omit<CheckItem, 'fingerprint'> & { ownWords?: string }, basis: unknown): CheckItem {
  const { ownWords, ...shown } = item;
  return { ...shown, fingerprint: fingerprint({ item: { ...shown, reasoning: ownWords ?? shown.reasoning }, basis }) };
}

/** SHA-256 of the value as JSON with its keys in order, so the same data gives the same print. */
export function fingerprint(value: unknown): string {
  return createHash('sha256')
    .update(JSON.stringify(ordered(value)))
    .digest('hex');
}

function ordered(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(ordered);
  if (value && typeof value === 'object')
    return Object.fromEntries(
      Object.entries(value)
        .filter(([, field]) => field !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
        .map(([key, field]) => [key, ordered(field)]),
    );
  return value;
}

function editionTitle(edition: EditionId): string {
  const match = /^(iecc|ashrae-90\.1)-(\d{4})$/.exec(edition);
  return match ? editionName(match[1] as 'iecc' | 'ashrae-90.1', Number(match[2])) : edition;
}

/** "IECC 2021 §C405.2.1", several sections once each; a table keeps its own word. */
function cited(edition: string, sections: readonly string[]): string {
  const distinct = [...new Set(sections.map((section) => section.trim()).filter(Boolean))];
  if (distinct.length === 0) return edition;
  return `${edition} ${distinct.map((section) => (/^(Table|§)/i.test(section) ? section : `§${section}`)).join(', ')}`;
}

interface UnitWords {
  area: string;
  /** Areas round to 1 ft² or 0.1 m². */
  areaPlaces: number;
  density: string;
}

function unitWords(units: EvaluationResult['units']): UnitWords {
  return units === 'ip' ? { area: 'ft²', areaPlaces: 0, density: 'W/ft²' } : { area: 'm²', areaPlaces: 1, density: 'W/m²' };
}

/** The quantity's unit from the rate's: "W/ft²" → " ft²", "W/location" → " locations"; a fixed allowance has none. */
function quantityUnit(rateUnit: string, quantity: string): string {
  const per = /^W\/(.+)$/.exec(rateUnit)?.[1];
  if (!per) return '';
  return /^(ft|m)/.test(per) || dec(quantity).equals(1) ? ` ${per}` : ` ${per}s`;
}

const grouping = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/**
 * A decimal for people, as the web app rounds it: half away from zero to `places`, grouped in
 * thousands; trailing zeros dropped unless `fixed` (power densities keep their two places).
 */
export function figure(value: string, places: number, fixed = false): string {
  const rounded = dec(value).toDecimalPlaces(places, Decimal.ROUND_HALF_UP);
  const [whole, fraction] = rounded.abs().toFixed(places).split('.') as [string, string | undefined];
  const trimmed = fixed ? (fraction ?? '') : (fraction?.replace(/0+$/, '') ?? '');
  const sign = rounded.isNegative() && !rounded.isZero() ? '-' : '';
  return `${sign}${grouping.format(BigInt(whole))}${trimmed ? `.${trimmed}` : ''}`;
}
