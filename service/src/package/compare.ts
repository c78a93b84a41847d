import type { ControlChange, RevisionComparison, SpaceMention, ValueChange } from '../../../contract/package.js';
import type { EvaluationResult, SpaceResult } from '../../../contract/result.js';
import { fixedDecimal } from './fingerprint.js';

type Figure = string | number | boolean | null | undefined;

const decimalLike = /^-?\d+(\.\d+)?$/;

function same(a: Figure, b: Figure): boolean {
  if (typeof a === 'string' && typeof b === 'string' && decimalLike.test(a) && decimalLike.test(b))
    return fixedDecimal(a) === fixedDecimal(b);
  return (a ?? null) === (b ?? null);
}

function shown(value: Figure): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return String(value);
}

function changes<T>(from: T, to: T, fields: readonly { field: string; label: string; read: (item: T) => Figure }[]): ValueChange[] {
  return fields
    .filter(({ read }) => !same(read(from), read(to)))
    .map(({ field, label, read }) => ({ field, label, from: shown(read(from)), to: shown(read(to)) }));
}

const totalFields: readonly { field: string; label: string; read: (result: EvaluationResult) => Figure }[] = [
  { field: 'interior.area', label: 'Interior floor area', read: (r) => r.interior.area },
  { field: 'interior.allowanceW', label: 'Interior allowance (W)', read: (r) => r.interior.allowanceW },
  { field: 'interior.installedW', label: 'Interior installed (W)', read: (r) => r.interior.installedW },
  { field: 'interior.exemptW', label: 'Interior exempt (W)', read: (r) => r.interior.exemptW },
  { field: 'interior.marginW', label: 'Interior margin (W)', read: (r) => r.interior.marginW },
  { field: 'interior.marginPct', label: 'Interior margin (%)', read: (r) => r.interior.marginPct },
  { field: 'interior.complies', label: 'Interior within its allowance', read: (r) => r.interior.complies },
  { field: 'exterior.allowanceW', label: 'Exterior allowance (W)', read: (r) => r.exterior?.allowanceW },
  { field: 'exterior.installedW', label: 'Exterior installed (W)', read: (r) => r.exterior?.installedW },
  { field: 'exterior.complies', label: 'Exterior within its allowance', read: (r) => r.exterior?.complies },
  { field: 'controlsComply', label: 'Controls met', read: (r) => r.controlsComply },
];

const spaceFields: readonly { field: string; label: string; read: (space: SpaceResult) => Figure }[] = [
  { field: 'name', label: 'Name', read: (s) => s.name },
  { field: 'level', label: 'Level', read: (s) => s.level },
  { field: 'lpdBasis', label: 'Space type', read: (s) => s.lpdBasis.label },
  { field: 'area', label: 'Floor area', read: (s) => s.area },
  { field: 'allowanceW', label: 'Allowance (W)', read: (s) => s.allowanceW },
  { field: 'installedW', label: 'Installed (W)', read: (s) => s.installedW },
  { field: 'exemptW', label: 'Exempt (W)', read: (s) => s.exemptW },
  { field: 'marginW', label: 'Margin (W)', read: (s) => s.marginW },
  { field: 'marginPct', label: 'Margin (%)', read: (s) => s.marginPct },
  { field: 'withinAllowance', label: 'Within its allowance', read: (s) => s.withinAllowance },
];

type Application = NonNullable<EvaluationResult['exterior']>['applications'][number];
const applicationFields: readonly { field: string; label: string; read: (application: Application) => Figure }[] = [
  { field: 'quantity', label: 'Quantity', read: (a) => a.quantity },
  { field: 'allowanceW', label: 'Allowance (W)', read: (a) => a.allowanceW },
  { field: 'installedW', label: 'Installed (W)', read: (a) => a.installedW },
  { field: 'marginW', label: 'Margin (W)', read: (a) => a.marginW },
  { field: 'withinAllowance', label: 'Within its allowance', read: (a) => a.withinAllowance },
];

const mention = (space: SpaceResult): SpaceMention => ({ id: space.id, name: space.name, level: space.level });

/** What changed from one revision's result to another's: spaces matched by their id, exterior applications by their key. */
export function compareResults(from: EvaluationResult, to: EvaluationResult): RevisionComparison {
  const before = new Map(from.interior.spaces.map((space) => [space.id, space]));
  const after = new Map(to.interior.spaces.map((space) => [space.id, space]));
  const spaces: RevisionComparison['spaces'] = {
    added: to.interior.spaces.filter((space) => !before.has(space.id)).map(mention),
    removed: from.interior.spaces.filter((space) => !after.has(space.id)).map(mention),
    changed: [],
  };
  const controls: ControlChange[] = [];
  for (const space of to.interior.spaces) {
    const old = before.get(space.id);
    if (!old) continue;
    const spaceChanges = changes(old, space, spaceFields);
    if (spaceChanges.length > 0) spaces.changed.push({ ...mention(space), changes: spaceChanges });
    const oldControls = new Map(old.controls.map((control) => [control.strategy, control]));
    const newControls = new Map(space.controls.map((control) => [control.strategy, control]));
    for (const strategy of new Set([...oldControls.keys(), ...newControls.keys()])) {
      const was = oldControls.get(strategy);
      const is = newControls.get(strategy);
      if (was?.status === is?.status) continue;
      controls.push({
        spaceId: space.id,
        spaceName: space.name,
        control: (is ?? was)!.label,
        from: was?.status ?? null,
        to: is?.status ?? null,
      });
    }
  }

  const oldApplications = new Map((from.exterior?.applications ?? []).map((application) => [application.key, application]));
  const newApplications = new Map((to.exterior?.applications ?? []).map((application) => [application.key, application]));
  const exterior: RevisionComparison['exterior'] = [];
  for (const key of new Set([...oldApplications.keys(), ...newApplications.keys()])) {
    const was = oldApplications.get(key);
    const is = newApplications.get(key);
    if (!was || !is) {
      exterior.push({ key, label: (is ?? was)!.label, change: is ? 'added' : 'removed', changes: [] });
      continue;
    }
    const applicationChanges = changes(was, is, applicationFields);
    if (applicationChanges.length > 0) exterior.push({ key, label: is.label, change: 'changed', changes: applicationChanges });
  }

  return {
    verdict: from.verdict === to.verdict ? null : { from: from.verdict, to: to.verdict },
    totals: changes(from, to, totalFields),
    spaces,
    controls,
    exterior,
  };
}
