import type {
  ExteriorApplicationRecord,
  ExteriorScheduleSettings,
  HistoryEntry,
  LuminaireGroup,
  LuminaireTypeRecord,
  ProjectRole,
  ProjectScope,
  ProvidedControl,
  SetupSnapshot,
  SpaceRecord,
  UnitConversion,
  UnitSystem,
} from '../../core/api/api-types';
import { quantityUnit } from '../exterior/exterior-groups';
import { exteriorControls } from '../exterior/exterior-application-form';
import { basisLabels, useLabels } from '../luminaires/luminaire-type-form';
import { exceptionReasonLabels } from '../controls/control-status';
import { methodLabels, scopeLabels } from '../setup/setup-fields';
import { timeZoneLabel } from '../setup/time-zones';
import { exteriorExemptions } from '../../../../../contract/editions';
import { reviewItemKindLabels, reviewVerdictLabels } from '../../../../../contract/review';

/**
 * A history entry in words: who did what, and which fields changed from what to what, in the units
 * the project had at the time. Nothing here ever shows a field path, a table key or an id: a key
 * the tables do not name is spelt out as words.
 */

/** What the code tables and editions call things; the page fills it from the store. */
export interface HistoryLabels {
  spaceTypes: ReadonlyMap<string, string>;
  buildingAreaTypes: ReadonlyMap<string, string>;
  controlStrategies: ReadonlyMap<string, string>;
  /** Each exterior application's name and rate unit (W/ft2, W/ft, W/location …). */
  exteriorApplications: ReadonlyMap<string, { label: string; unit: string }>;
  editions: ReadonlyMap<string, string>;
}

export const noLabels: HistoryLabels = {
  spaceTypes: new Map(),
  buildingAreaTypes: new Map(),
  controlStrategies: new Map(),
  exteriorApplications: new Map(),
  editions: new Map(),
};

export interface EntryWords {
  /** The person, or "Someone" when their account is gone. */
  actor: string;
  /** What they did, after the actor: "changed space “Exam 1”". */
  summary: string;
  /** The fields that changed, each in words: "floor area 120 → 150 ft²". */
  changes: string[];
  /** The whole sentence. */
  sentence: string;
  icon: string;
}

const number = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

type Plain = string | number | boolean | null | undefined;

function blank(value: Plain): boolean {
  return value === null || value === undefined || value === '';
}

/** A stored decimal for reading: grouped, at most two places, unless that would hide a change. */
function figure(value: Plain): string {
  const parsed = Number(value);
  return blank(value) || !Number.isFinite(parsed) ? String(value ?? '') : number.format(parsed);
}

/** A key no table names, spelt as words: `parking-lots-and-drives` → "parking lots and drives". */
export function spelt(key: string): string {
  return key.replace(/[-_:]+/g, ' ').trim();
}

function quoted(text: string): string {
  return `“${text}”`;
}

function lowerFirst(label: string): string {
  // Leave acronyms (IECC, SI) as they are.
  return /^[A-Z][a-z]/.test(label) ? label[0]!.toLocaleLowerCase() + label.slice(1) : label;
}

function plural(count: number, one: string, many = `${one}s`): string {
  return `${number.format(count)} ${count === 1 ? one : many}`;
}

function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(normalised(a)) === JSON.stringify(normalised(b));
}

/** Absent, null and empty mean the same; key order does not matter. */
function normalised(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(normalised);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value)
        .filter(([, field]) => !blank(field as Plain))
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([key, field]) => [key, normalised(field)]),
    );
  }
  return blank(value as Plain) ? null : value;
}

// ---------------------------------------------------------------- one field

/** A measured value: "floor area 120 → 150 ft²", "ceiling height set to 10 ft". */
function measured(label: string, before: Plain, after: Plain, unit: string): string | null {
  if (same(before, after)) return null;
  const suffix = unit ? ` ${unit}` : '';
  if (blank(before)) return `${label} set to ${figure(after)}${suffix}`;
  if (blank(after)) return `${label} cleared (was ${figure(before)}${suffix})`;
  let from = figure(before);
  let to = figure(after);
  if (from === to) [from, to] = [String(before), String(after)];
  return `${label} ${from} → ${to}${suffix}`;
}

/** A text value, quoted: "name “Exam 1” → “Exam 2”". */
function text(label: string, before: Plain, after: Plain): string | null {
  if (same(before, after)) return null;
  if (blank(before)) return `${label} set to ${quoted(String(after))}`;
  if (blank(after)) return `${label} cleared (was ${quoted(String(before))})`;
  return `${label} ${quoted(String(before))} → ${quoted(String(after))}`;
}

/** A choice from a list, by its label: "space type Office — Enclosed → Storage Room". */
function choice(label: string, before: Plain, after: Plain, name: (value: string) => string): string | null {
  if (same(before, after)) return null;
  if (blank(before)) return `${label} set to ${name(String(after))}`;
  if (blank(after)) return `${label} cleared (was ${name(String(before))})`;
  return `${label} ${name(String(before))} → ${name(String(after))}`;
}

function named(labels: ReadonlyMap<string, string>): (key: string) => string {
  return (key) => labels.get(key) ?? spelt(key);
}

function units(system: UnitSystem) {
  return system === 'ip' ? { length: 'ft', area: 'ft²' } : { length: 'm', area: 'm²' };
}

// ---------------------------------------------------------------- children

const zoneWords: Record<string, string> = {
  'primary-sidelit': 'primary sidelit zone',
  'secondary-sidelit': 'secondary sidelit zone',
  toplit: 'toplit zone',
};

function groupKey(group: LuminaireGroup): string {
  return group.zone ? `${group.tag} (${zoneWords[group.zone] ?? spelt(group.zone)})` : group.tag;
}

/** Luminaire counts by tag: "luminaires: A × 4 → A × 6, B × 2 added". */
function luminaireChanges(before: readonly LuminaireGroup[], after: readonly LuminaireGroup[]): string | null {
  const counts = (groups: readonly LuminaireGroup[]) => new Map(groups.map((group) => [groupKey(group), group.count]));
  const was = counts(before);
  const now = counts(after);
  const parts: string[] = [];
  for (const [key, count] of now) {
    const old = was.get(key);
    if (old === undefined) parts.push(`${key} × ${figure(count)} added`);
    else if (!same(old, count)) parts.push(`${key} × ${figure(old)} → ${key} × ${figure(count)}`);
  }
  for (const [key, count] of was) if (!now.has(key)) parts.push(`${key} × ${figure(count)} removed`);
  return parts.length ? `luminaires: ${parts.join(', ')}` : null;
}

const autoOnWords: Record<string, string> = { manual: 'manual on', partial: 'automatic on to at most 50 %', full: 'full automatic on' };
const exteriorControlLabels = new Map<string, string>(exteriorControls.map((control) => [control.strategy, control.label]));

function controlLabel(strategy: string, labels: HistoryLabels): string {
  return lowerFirst(labels.controlStrategies.get(strategy) ?? exteriorControlLabels.get(strategy) ?? spelt(strategy));
}

function reasonWords(reason: string): string {
  return lowerFirst(exceptionReasonLabels[reason as keyof typeof exceptionReasonLabels] ?? spelt(reason));
}

function exceptionChange(before: string | undefined, after: string | undefined): string | null {
  if (same(before, after)) return null;
  if (blank(before)) return `exception claimed (${reasonWords(after!)})`;
  if (blank(after)) return 'exception withdrawn';
  return `exception ${reasonWords(before!)} → ${reasonWords(after!)}`;
}

/** What changed inside one control: "time-out 15 → 20 min, device “A” → “B”". */
function controlDetails(before: ProvidedControl | undefined, after: ProvidedControl, areaUnit: string): string[] {
  const parts: (string | null)[] = [];
  if (before && before.provided !== after.provided) parts.push(after.provided ? 'now provided' : 'no longer provided');
  parts.push(
    measured('time-out', before?.timeoutMinutes, after.timeoutMinutes, 'min'),
    measured('zone size', before?.zoneSize, after.zoneSize, areaUnit),
    measured('reduction', before?.reductionPercent, after.reductionPercent, '%'),
    choice('switching on', before?.autoOn, after.autoOn, (value) => autoOnWords[value] ?? spelt(value)),
    text('device', before?.device, after.device),
    exceptionChange(before?.exceptionReason, after.exceptionReason),
    text('exception note', before?.exceptionNote, after.exceptionNote),
  );
  return parts.filter((part): part is string => part !== null);
}

/** One line per control that changed: "controls: occupant sensor added". */
function controlChanges(
  before: readonly ProvidedControl[],
  after: readonly ProvidedControl[],
  labels: HistoryLabels,
  areaUnit: string,
): string[] {
  const was = new Map(before.map((control) => [control.strategy, control]));
  const now = new Map(after.map((control) => [control.strategy, control]));
  const lines: string[] = [];
  for (const [strategy, control] of now) {
    const label = controlLabel(strategy, labels);
    const old = was.get(strategy);
    if (!old) {
      if (control.provided) lines.push(`controls: ${label} added`);
      else if (control.exceptionReason)
        lines.push(`controls: ${label} not provided, exception claimed (${reasonWords(control.exceptionReason)})`);
      else lines.push(`controls: ${label} marked not provided`);
    } else if (!same(old, control)) {
      const details = controlDetails(old, control, areaUnit);
      if (details.length) lines.push(`controls: ${label} ${details.join(', ')}`);
    }
  }
  for (const strategy of was.keys()) if (!now.has(strategy)) lines.push(`controls: ${controlLabel(strategy, labels)} removed`);
  return lines;
}

/** Openings by count: "2 windows → 3 windows", or that they changed at the same count. */
function openingChanges(one: string, before: readonly unknown[], after: readonly unknown[]): string | null {
  if (same(before, after)) return null;
  const count = (n: number) => (n === 0 ? `no ${one}s` : plural(n, one));
  if (before.length !== after.length) return `${count(before.length)} → ${count(after.length)}`;
  return `${one}s changed (${count(after.length)})`;
}

// ---------------------------------------------------------------- records

function spaceChanges(before: SpaceRecord, after: SpaceRecord, labels: HistoryLabels, system: UnitSystem): string[] {
  const { length, area } = units(system);
  const changes = [
    text('name', before.name, after.name),
    text('level', before.level, after.level),
    choice('space type', before.spaceType, after.spaceType, named(labels.spaceTypes)),
    choice('building area type', before.buildingAreaType, after.buildingAreaType, named(labels.buildingAreaTypes)),
    choice('space type for controls', before.controlSpaceType, after.controlSpaceType, named(labels.spaceTypes)),
    measured('floor area', before.area, after.area, area),
    measured('like rooms in the entry', before.rooms, after.rooms, ''),
    measured('ceiling height', before.ceilingHeight, after.ceilingHeight, length),
    measured('room length', before.length, after.length, length),
    measured('room width', before.width, after.width, length),
    measured('luminaire height', before.luminaireHeight, after.luminaireHeight, length),
    measured('work plane height', before.workPlaneHeight, after.workPlaneHeight, length),
    !!before.enclosed === !!after.enclosed ? null : after.enclosed ? 'now an enclosed room' : 'no longer an enclosed room',
    luminaireChanges(before.luminaires ?? [], after.luminaires ?? []),
    ...controlChanges(before.controls ?? [], after.controls ?? [], labels, area),
    openingChanges('window', before.windows ?? [], after.windows ?? []),
    openingChanges('skylight', before.skylights ?? [], after.skylights ?? []),
  ];
  return changes.filter((change): change is string => change !== null);
}

function luminaireTypeChanges(before: LuminaireTypeRecord, after: LuminaireTypeRecord, system: UnitSystem): string[] {
  const changes = [
    text('tag', before.tag, after.tag),
    text('description', before.description, after.description),
    measured('rated input', before.inputWatts, after.inputWatts, 'W'),
    choice('use', before.use, after.use, (value) => lowerFirst(useLabels[value as keyof typeof useLabels] ?? spelt(value))),
    text('reason for the exemption', before.exemptReason, after.exemptReason),
    choice('wattage basis', before.basis, after.basis, (value) =>
      lowerFirst(basisLabels[value as keyof typeof basisLabels] ?? spelt(value)),
    ),
    measured('track length', before.length, after.length, units(system).length),
    measured('limiter rating', before.limitWatts, after.limitWatts, 'W'),
    text('wattage from', before.wattageSource, after.wattageSource),
  ];
  return changes.filter((change): change is string => change !== null);
}

function exteriorQuantityUnit(key: string, labels: HistoryLabels, system: UnitSystem): string {
  const unit = labels.exteriorApplications.get(key)?.unit;
  return unit ? quantityUnit(unit, system) : '';
}

function exteriorChanges(
  before: ExteriorApplicationRecord,
  after: ExteriorApplicationRecord,
  labels: HistoryLabels,
  system: UnitSystem,
): string[] {
  const changes = [
    choice('application', before.key, after.key, (key) => exteriorLabel(key, labels)),
    text('description', before.description, after.description),
    measured('quantity', before.quantity, after.quantity, exteriorQuantityUnit(after.key, labels, system)),
    measured('installed', before.installedWatts, after.installedWatts, 'W'),
    measured('exempt', before.exemptWatts, after.exemptWatts, 'W'),
    choice('reason it is exempt', before.exemptReason, after.exemptReason, exemptionLabel),
    text('exemption note', before.exemptNote, after.exemptNote),
    ...controlChanges(before.controls ?? [], after.controls ?? [], labels, units(system).area),
  ];
  return changes.filter((change): change is string => change !== null);
}

/** An exterior exemption by its words (the reason keys mean the same in both edition families). */
function exemptionLabel(reason: string): string {
  const listed = [...exteriorExemptions['ashrae-90.1'], ...exteriorExemptions.iecc].find((exemption) => exemption.reason === reason);
  return listed ? lowerFirst(listed.label) : spelt(reason);
}

function exteriorLabel(key: string, labels: HistoryLabels): string {
  return labels.exteriorApplications.get(key)?.label ?? spelt(key);
}

const unitNames: Record<UnitSystem, string> = { ip: 'IP', si: 'SI' };

/** The entry keeps only the amendments' keys, so the change is told by count: "jurisdiction amendments: model code only → 1 chosen". */
function amendmentChange(before: readonly string[] | undefined, after: readonly string[] | undefined): string | null {
  if (before === undefined || after === undefined) return null;
  if (before.length === after.length && before.every((key) => after.includes(key))) return null;
  const words = (keys: readonly string[]) => (keys.length === 0 ? 'model code only' : `${keys.length} chosen`);
  return before.length === after.length ? 'jurisdiction amendments changed' : `jurisdiction amendments: ${words(before)} → ${words(after)}`;
}

function setupChanges(before: SetupSnapshot, after: SetupSnapshot, labels: HistoryLabels): string[] {
  const changes = [
    text('project name', before.name, after.name),
    text('address', before.address, after.address),
    measured('latitude', before.latitude, after.latitude, ''),
    measured('longitude', before.longitude, after.longitude, ''),
    choice('time zone', before.timeZone, after.timeZone, timeZoneLabel),
    text('jurisdiction', before.jurisdiction, after.jurisdiction),
    choice('code edition', before.edition, after.edition, named(labels.editions)),
    choice('compliance method', before.method, after.method, (method) =>
      lowerFirst(methodLabels[method as keyof typeof methodLabels] ?? spelt(method)),
    ),
    choice('units', before.units, after.units, (system) => unitNames[system as UnitSystem] ?? spelt(system)),
    choice('exterior lighting zone', before.lightingZone, after.lightingZone, (zone) => zone),
    amendmentChange(before.amendments, after.amendments),
    text('permit number', before.permitNumber, after.permitNumber),
    text('owner', before.owner, after.owner),
    text('occupancy', before.occupancy, after.occupancy),
    choice('scope of work', before.scope, after.scope, (scope) => lowerFirst(scopeLabels[scope as ProjectScope] ?? spelt(scope))),
    measured('gross floor area', before.grossFloorArea, after.grossFloorArea, units(after.units).area),
    text('designer of record', before.designerName, after.designerName),
    text('designer’s firm', before.designerFirm, after.designerFirm),
    text('designer’s licence number', before.designerLicence, after.designerLicence),
    text('contractor', before.contractorName, after.contractorName),
    text('contractor’s firm', before.contractorFirm, after.contractorFirm),
    text('contractor’s licence number', before.contractorLicence, after.contractorLicence),
    text('contractor’s contact', before.contractorContact, after.contractorContact),
  ];
  return changes.filter((change): change is string => change !== null);
}

const convertedRows: Record<string, [string, string]> = {
  spaces: ['space', 'spaces'],
  space_windows: ['window', 'windows'],
  space_skylights: ['skylight', 'skylights'],
  space_controls: ['control', 'controls'],
  luminaire_types: ['luminaire type', 'luminaire types'],
  retail_display_claims: ['sales area claim', 'sales area claims'],
  exterior_applications: ['exterior application', 'exterior applications'],
};

/** "(29 spaces and 4 windows converted)"; rows of a kind this list does not know are left out rather than named by their table. */
function conversionWords(conversion: UnitConversion | undefined): string {
  const counted = Object.entries(conversion?.rows ?? {})
    .filter(([table, count]) => count > 0 && convertedRows[table])
    .map(([table, count]) => plural(count, ...convertedRows[table]!));
  return counted.length ? ` (${listInWords(counted)} converted)` : ' (nothing stored needed converting)';
}

// ---------------------------------------------------------------- entries

const entityWords = { space: 'space', 'luminaire-type': 'luminaire type', 'exterior-application': 'exterior application' } as const;
const roleWords: Record<ProjectRole, string> = { engineer: 'engineer', reviewer: 'reviewer', contractor: 'contractor' };

function roleWord(role: string | undefined): string {
  return role ? (roleWords[role as ProjectRole] ?? spelt(role)) : 'a member';
}

const icons: Record<string, string> = {
  transition: 'rule',
  create: 'add_circle',
  import: 'upload_file',
  update: 'edit',
  delete: 'delete',
  restore: 'restore_from_trash',
  'convert-units': 'straighten',
  copy: 'content_copy',
  archive: 'archive',
  unarchive: 'unarchive',
  'add-member': 'person_add',
  'change-role': 'manage_accounts',
  'remove-member': 'person_remove',
  'add-member-no-account': 'person_search',
  verdict: 'fact_check',
  reply: 'forum',
  'bulk-confirm': 'done_all',
  invite: 'forward_to_inbox',
  'withdraw-invitation': 'cancel_schedule_send',
  'accept-invitation': 'how_to_reg',
  record: 'checklist',
  retest: 'replay',
  'attach-cut-sheet': 'attach_file',
  'remove-cut-sheet': 'link_off',
};

/**
 * What a person calls a design item in a sentence: space “Exam 1”, exterior application “North
 * lot” (Parking lots and drives). `briefed` leaves the catalogue name to the brief that follows.
 */
function itemName(
  entry: Extract<HistoryEntry, { entity: 'space' | 'luminaire-type' | 'exterior-application' }>,
  labels: HistoryLabels,
  briefed = false,
): string {
  if (entry.entity === 'exterior-application') {
    const record = entry.after ?? entry.before;
    if (!record) return `an ${entityWords[entry.entity]}`;
    const label = exteriorLabel(record.key, labels);
    if (!record.description) return `${entityWords[entry.entity]} ${quoted(label)}`;
    return `${entityWords[entry.entity]} ${quoted(record.description)}${briefed ? '' : ` (${label})`}`;
  }
  const record = entry.after ?? entry.before;
  const name =
    entry.name ?? (entry.entity === 'space' ? (record as SpaceRecord | null)?.name : (record as LuminaireTypeRecord | null)?.tag);
  return name ? `${entityWords[entry.entity]} ${quoted(name)}` : `a ${entityWords[entry.entity]}`;
}

/** A short description of a design item as it was added or deleted: "(Level 1, 120 ft², Office — Enclosed)". */
function itemBrief(
  entry: Extract<HistoryEntry, { entity: 'space' | 'luminaire-type' | 'exterior-application' }>,
  labels: HistoryLabels,
  system: UnitSystem,
): string {
  const parts: string[] = [];
  if (entry.entity === 'space') {
    const space = entry.after ?? entry.before;
    if (!space) return '';
    if (space.level) parts.push(space.level);
    if (!blank(space.area)) parts.push(`${figure(space.area)} ${units(system).area}`);
    const type = space.spaceType
      ? named(labels.spaceTypes)(space.spaceType)
      : space.buildingAreaType
        ? named(labels.buildingAreaTypes)(space.buildingAreaType)
        : null;
    if (type) parts.push(type);
  } else if (entry.entity === 'luminaire-type') {
    const type = entry.after ?? entry.before;
    if (!type) return '';
    if (!blank(type.inputWatts)) parts.push(`${figure(type.inputWatts)} W`);
    if (type.use) parts.push(lowerFirst(useLabels[type.use] ?? spelt(type.use)));
  } else {
    const application = entry.after ?? entry.before;
    if (!application) return '';
    if (application.description) parts.push(exteriorLabel(application.key, labels));
    if (!blank(application.quantity))
      parts.push(`${figure(application.quantity)} ${exteriorQuantityUnit(application.key, labels, system)}`.trim());
    if (!blank(application.installedWatts)) parts.push(`${figure(application.installedWatts)} W installed`);
  }
  return parts.length ? ` (${parts.join(', ')})` : '';
}

function designWords(
  entry: Extract<HistoryEntry, { entity: 'space' | 'luminaire-type' | 'exterior-application' }>,
  labels: HistoryLabels,
  system: UnitSystem,
): { summary: string; changes: string[] } {
  const name = itemName(entry, labels);
  const briefed = `${itemName(entry, labels, true)}${itemBrief(entry, labels, system)}`;
  switch (entry.action) {
    case 'create':
      return { summary: `added ${briefed}`, changes: [] };
    case 'import':
      return { summary: `imported ${itemName(entry, labels, true)} from a spreadsheet${itemBrief(entry, labels, system)}`, changes: [] };
    case 'delete':
      return { summary: `deleted ${briefed}`, changes: [] };
    case 'restore':
      return { summary: `restored ${name}`, changes: [] };
    case 'update': {
      const changes = !entry.before || !entry.after ? [] : designChanges(entry, labels, system);
      return { summary: changes.length ? `changed ${name}` : `saved ${name} without a change`, changes };
    }
    default:
      return { summary: `changed ${name}`, changes: [] };
  }
}

function designChanges(
  entry: Extract<HistoryEntry, { entity: 'space' | 'luminaire-type' | 'exterior-application' }>,
  labels: HistoryLabels,
  system: UnitSystem,
): string[] {
  switch (entry.entity) {
    case 'space':
      return spaceChanges(entry.before!, entry.after!, labels, system);
    case 'luminaire-type':
      return luminaireTypeChanges(entry.before!, entry.after!, system);
    case 'exterior-application':
      return exteriorChanges(entry.before!, entry.after!, labels, system);
  }
}

function projectWords(entry: Extract<HistoryEntry, { entity: 'project' }>, labels: HistoryLabels): { summary: string; changes: string[] } {
  const changes = entry.before && entry.after ? setupChanges(entry.before, entry.after, labels) : [];
  switch (entry.action) {
    case 'create':
      return { summary: `created the project${entry.name ? ` ${quoted(entry.name)}` : ''}`, changes: [] };
    case 'copy':
      return {
        summary: `made this project${entry.name ? ` ${quoted(entry.name)}` : ''} as a copy${entry.copiedFrom ? ` of ${quoted(entry.copiedFrom.name)}` : ''}`,
        changes: [],
      };
    case 'transition': {
      const move = entry.transition;
      if (!move) return { summary: 'moved the project’s review state', changes: [] };
      const revision = move.to === 'draft' ? ` (revision ${move.revision})` : '';
      return { summary: `${move.words.toLowerCase()}${revision}`, changes: move.comment ? [`comment: ${quoted(move.comment)}`] : [] };
    }
    case 'archive':
      return { summary: 'archived the project', changes: [] };
    case 'unarchive':
      return { summary: 'unarchived the project', changes: [] };
    case 'convert-units': {
      const from = entry.conversion?.from ?? entry.before?.units;
      const to = entry.conversion?.to ?? entry.after?.units;
      const summary =
        from && to
          ? `changed the units from ${unitNames[from]} to ${unitNames[to]}${conversionWords(entry.conversion)}`
          : 'changed the units';
      return { summary, changes: changes.filter((change) => !change.startsWith('units ')) };
    }
    default:
      return { summary: changes.length ? 'changed the set-up' : 'saved the set-up without a change', changes };
  }
}

/** A sales floor's claim on an additional allowance; `name` is the space's. */
function claimWords(
  entry: Extract<HistoryEntry, { entity: 'additional-allowance' }>,
  system: UnitSystem,
): { summary: string; changes: string[] } {
  const where = entry.name ? ` on ${quoted(entry.name)}` : '';
  const area = (claim: { area: string } | null) => (claim ? ` for ${figure(claim.area)} ${units(system).area}` : '');
  switch (entry.action) {
    case 'create':
      return { summary: `claimed an additional allowance${where}${area(entry.after)}`, changes: [] };
    case 'delete':
      return { summary: `removed an additional allowance claimed${where}${area(entry.before)}`, changes: [] };
    case 'restore':
      return { summary: `restored an additional allowance claimed${where}${area(entry.after)}`, changes: [] };
    default: {
      const changes =
        entry.before && entry.after
          ? [measured('area claimed', entry.before.area, entry.after.area, units(system).area)].filter(
              (change): change is string => change !== null,
            )
          : [];
      return { summary: `changed an additional allowance claimed${where}`, changes };
    }
  }
}

function teamWords(entry: Extract<HistoryEntry, { entity: 'project_member' }>): { summary: string; changes: string[] } {
  const who = entry.name ?? 'a person';
  switch (entry.action) {
    case 'add-member':
      return { summary: `added ${who} to the team as ${roleWord(entry.after?.role)}`, changes: [] };
    case 'change-role':
      return { summary: `changed the role of ${who} from ${roleWord(entry.before?.role)} to ${roleWord(entry.after?.role)}`, changes: [] };
    case 'remove-member':
      return { summary: `removed ${who} from the team${entry.before?.role ? ` (was ${roleWord(entry.before.role)})` : ''}`, changes: [] };
    case 'add-member-no-account':
      return { summary: `asked to add ${who} to the team; no one was added`, changes: [] };
    default:
      return { summary: 'changed the team', changes: [] };
  }
}

/** A reviewer's verdict on a check item, a reply in its thread, or a bulk confirmation; `name` is the item's title. */
function reviewWords(entry: Extract<HistoryEntry, { entity: 'review-item' }>): { summary: string; changes: string[] } {
  const review = entry.review;
  const item = entry.name ? `the check item ${quoted(entry.name)}` : 'a check item';
  switch (entry.action) {
    case 'verdict': {
      const verdict = review?.verdict ? reviewVerdictLabels[review.verdict] : null;
      return {
        summary: verdict ? `marked ${item} as ‘${verdict}’` : `recorded a verdict on ${item}`,
        changes: review?.comment ? [`comment: ${quoted(review.comment)}`] : [],
      };
    }
    case 'reply':
      return { summary: `replied on ${item}`, changes: review?.text ? [quoted(review.text)] : [] };
    case 'bulk-confirm': {
      const which = review?.kind ? `every ${reviewItemKindLabels[review.kind]} item` : 'every unchanged check item';
      const count = review?.count === undefined ? '' : ` (${plural(review.count, 'item')})`;
      return { summary: `confirmed ${which} that had no verdict${count}`, changes: [] };
    }
    default:
      return { summary: `changed ${item}`, changes: [] };
  }
}

function invitationWords(entry: Extract<HistoryEntry, { entity: 'invitation' }>): { summary: string; changes: string[] } {
  const who = entry.name ?? 'a person';
  switch (entry.action) {
    case 'invite':
      return { summary: `invited ${who} by e-mail to join the team as ${roleWord(entry.after?.role)}`, changes: [] };
    case 'withdraw-invitation':
      return {
        summary: `withdrew the invitation of ${who}${entry.before?.role ? ` (as ${roleWord(entry.before.role)})` : ''}`,
        changes: [],
      };
    case 'accept-invitation':
      return { summary: `accepted the invitation sent to ${who} and joined the team as ${roleWord(entry.after?.role)}`, changes: [] };
    default:
      return { summary: 'changed an invitation to the team', changes: [] };
  }
}

/** A submittal package made: its revision, draft or final, and the start of its fingerprint as printed. */
function packageWords(entry: Extract<HistoryEntry, { entity: 'package' }>): { summary: string; changes: string[] } {
  const made = entry.package;
  if (!made) return { summary: 'made a submittal package', changes: [] };
  return {
    summary: `made ${made.draft ? 'a draft' : 'the final'} submittal package, revision ${made.revision}`,
    changes: [`fingerprint ${made.fingerprint.slice(0, 12)}…`],
  };
}

/** A functional test recorded by the contractor, or a retest; `name` is the test item's title. */
function fieldTestWords(entry: Extract<HistoryEntry, { entity: 'field-test' }>): { summary: string; changes: string[] } {
  const test = entry.fieldTest;
  const item = entry.name ? quoted(entry.name) : 'a functional test item';
  const outcome = test?.result === 'pass' ? 'passed' : test?.result === 'fail' ? 'failed' : null;
  const verb = entry.action === 'retest' ? 'retested' : 'tested';
  const summary = outcome ? `${verb} ${item}, which ${outcome}` : `recorded a functional test of ${item}`;
  const measured = test?.measured ?? {};
  const changes = [
    blank(measured.timeoutMinutes) ? null : `time-out ${figure(measured.timeoutMinutes)} min`,
    blank(measured.lightLevel) ? null : `light level ${figure(measured.lightLevel)} ${test?.lightLevelUnit === 'lux' ? 'lx' : 'fc'}`,
    blank(measured.overrideMinutes) ? null : `override ${figure(measured.overrideMinutes)} min`,
    test?.notes ? `notes: ${quoted(test.notes)}` : null,
  ].filter((change): change is string => change !== null);
  return { summary, changes };
}

type CutSheetEntry = Extract<HistoryEntry, { action: 'attach-cut-sheet' | 'remove-cut-sheet' }>;

function isCutSheetEntry(entry: HistoryEntry): entry is CutSheetEntry {
  return entry.action === 'attach-cut-sheet' || entry.action === 'remove-cut-sheet';
}

/** A cut sheet attached to, replaced on or removed from a luminaire type; `name` is the type's tag. */
function cutSheetWords(entry: CutSheetEntry): { summary: string; changes: string[] } {
  const type = entry.name ? `luminaire type ${quoted(entry.name)}` : 'a luminaire type';
  const file = entry.cutSheet ? ` ${quoted(entry.cutSheet.fileName)}` : '';
  if (entry.action === 'remove-cut-sheet') return { summary: `removed the cut sheet${file} from ${type}`, changes: [] };
  if (entry.replaced)
    return { summary: `replaced the cut sheet of ${type} with${file}`, changes: [`was ${quoted(entry.replaced.fileName)}`] };
  return { summary: `attached the cut sheet${file} to ${type}`, changes: [] };
}

/** The exterior schedule's settings in words: the offsets, and the setback window with its reduction. */
function scheduleSettingsWords(settings: ExteriorScheduleSettings): string {
  const setback = settings.setback
    ? `set back ${settings.setback.start}–${settings.setback.end}${settings.setback.reductionPercent !== undefined ? ` by ${settings.setback.reductionPercent} %` : ' by the edition’s reduction'}`
    : 'no night setback';
  return `on ${settings.onMinutesBeforeSunset} min before sunset, off ${settings.offMinutesAfterSunrise} min after sunrise, ${setback}`;
}

/** The project's exterior schedule saved. */
function scheduleWords(entry: Extract<HistoryEntry, { entity: 'exterior-schedule' }>): { summary: string; changes: string[] } {
  const changes: string[] = [];
  if (entry.after)
    changes.push(entry.before ? `from ${scheduleSettingsWords(entry.before)}` : '', `to ${scheduleSettingsWords(entry.after)}`);
  return { summary: 'saved the exterior schedule', changes: changes.filter((change) => change !== '') };
}

/** One entry in words, with `system` the units the project had when it was made (see {@link unitsAtEntry}). */
export function describeEntry(entry: HistoryEntry, labels: HistoryLabels, system: UnitSystem): EntryWords {
  const actor = entry.user?.name || 'Someone';
  let words: { summary: string; changes: string[] };
  switch (entry.entity) {
    case 'space':
    case 'luminaire-type':
    case 'exterior-application':
      words = isCutSheetEntry(entry) ? cutSheetWords(entry) : designWords(entry, labels, system);
      break;
    case 'project':
      words = projectWords(entry, labels);
      break;
    case 'project_member':
      words = teamWords(entry);
      break;
    case 'invitation':
      words = invitationWords(entry);
      break;
    case 'additional-allowance':
      words = claimWords(entry, system);
      break;
    case 'review-item':
      words = reviewWords(entry);
      break;
    case 'package':
      words = packageWords(entry);
      break;
    case 'field-test':
      words = fieldTestWords(entry);
      break;
    case 'exterior-schedule':
      words = scheduleWords(entry);
      break;
    default:
      words = { summary: 'changed the project', changes: [] };
  }
  return { actor, ...words, sentence: sentence(actor, words.summary, words.changes), icon: icons[entry.action] ?? 'history' };
}

function sentence(actor: string, summary: string, changes: readonly string[]): string {
  return `${actor} ${summary}${changes.length ? `: ${changes.join('; ')}` : ''}`;
}

/**
 * One import is one entry per space: consecutive entries of the same import (same person, same
 * moment) read as one line.
 */
export function describeImport(entries: readonly HistoryEntry[], labels: HistoryLabels, system: UnitSystem): EntryWords {
  if (entries.length === 1) return describeEntry(entries[0]!, labels, system);
  const actor = entries[0]?.user?.name || 'Someone';
  // The history lists newest first; the names read in the order of the sheet.
  const names = [...entries].sort((a, b) => (BigInt(a.id) < BigInt(b.id) ? -1 : 1)).map((entry) => quoted(entry.name ?? 'unnamed'));
  const shown = names.length > 4 ? `${names.slice(0, 3).join(', ')} and ${plural(names.length - 3, 'more', 'more')}` : listInWords(names);
  const summary = `imported ${plural(entries.length, 'space')} from a spreadsheet: ${shown}`;
  return { actor, summary, changes: [], sentence: sentence(actor, summary, []), icon: icons['import']! };
}

export type HistoryItem = { kind: 'entry'; entry: HistoryEntry } | { kind: 'import'; entries: HistoryEntry[] };

/** Entries as the page lists them: each on its own, except the spaces of one import together. */
export function historyItems(entries: readonly HistoryEntry[]): HistoryItem[] {
  const items: HistoryItem[] = [];
  for (const entry of entries) {
    const last = items[items.length - 1];
    if (
      entry.action === 'import' &&
      last?.kind === 'import' &&
      last.entries[0]!.at === entry.at &&
      last.entries[0]!.user?.id === entry.user?.id
    ) {
      last.entries.push(entry);
    } else if (entry.action === 'import') {
      items.push({ kind: 'import', entries: [entry] });
    } else {
      items.push({ kind: 'entry', entry });
    }
  }
  return items;
}

/** A change of units seen in the history: entries older than it were made in `from`. */
export interface UnitsChange {
  id: string;
  from: UnitSystem;
}

export function unitsChanges(entries: readonly HistoryEntry[]): UnitsChange[] {
  const changes: UnitsChange[] = [];
  for (const entry of entries) {
    if (entry.entity !== 'project' || entry.action !== 'convert-units') continue;
    const from = entry.conversion?.from ?? entry.before?.units;
    if (from) changes.push({ id: entry.id, from });
  }
  return changes;
}

/**
 * The units a project had when an entry was made: those it has now, unless the units were changed
 * since, in which case those before the first change after the entry. Stored values are kept in
 * the units of their time, so this is the unit their figures are in.
 */
export function unitsAtEntry(entryId: string, current: UnitSystem, changes: readonly UnitsChange[]): UnitSystem {
  const id = BigInt(entryId);
  let oldestLater: UnitsChange | null = null;
  for (const change of changes) {
    const changeId = BigInt(change.id);
    if (changeId > id && (!oldestLater || changeId < BigInt(oldestLater.id))) oldestLater = change;
  }
  return oldestLater ? oldestLater.from : current;
}

// ---------------------------------------------------------------- time

const exact = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
const relative = new Intl.RelativeTimeFormat('en-US', { numeric: 'auto' });

export function exactTime(at: string): string {
  return exact.format(new Date(at));
}

/** "just now", "5 minutes ago", "yesterday", "3 weeks ago". */
export function relativeTime(at: string, now: Date): string {
  const seconds = (new Date(at).getTime() - now.getTime()) / 1000;
  if (Math.abs(seconds) < 45) return 'just now';
  const minutes = seconds / 60;
  if (Math.abs(minutes) < 59.5) return relative.format(Math.round(minutes), 'minute');
  const hours = minutes / 60;
  if (Math.abs(hours) < 23.5) return relative.format(Math.round(hours), 'hour');
  const days = hours / 24;
  if (Math.abs(days) < 6.5) return relative.format(Math.round(days), 'day');
  if (Math.abs(days) < 30) return relative.format(Math.round(days / 7), 'week');
  if (Math.abs(days) < 365) return relative.format(Math.round(days / 30.44), 'month');
  return relative.format(Math.round(days / 365.25), 'year');
}

/** A design item as a sentence names it ("space “Exam 3”"), for its Restore button and the snackbar after. */
export function itemWords(entry: HistoryEntry, labels: HistoryLabels): string {
  if (entry.entity === 'additional-allowance') return entry.name ? `the claim on ${quoted(entry.name)}` : 'the claim';
  if (entry.entity !== 'space' && entry.entity !== 'luminaire-type' && entry.entity !== 'exterior-application') return 'the item';
  return itemName(entry, labels);
}

/** The snackbar's words once a deleted item is back: "Space “Exam 3” restored". */
export function restoredWords(entry: HistoryEntry, labels: HistoryLabels): string {
  const name = itemWords(entry, labels);
  return `${name[0]!.toLocaleUpperCase()}${name.slice(1)} restored`;
}
