import type { ControlLine, EvaluationResult, SpaceResult } from '../../core/api/api-types';
import { formatWatts } from '../../shared/format';
import type { WorkspaceLink } from '../../shared/problem-words';
import { statusView } from '../controls/control-status';

/** One thing that keeps the design from complying, and where it is fixed. */
export interface ReasonItem {
  text: string;
  link: WorkspaceLink;
}

export type ReasonKind = 'interior-power' | 'interior-controls' | 'exterior-power' | 'exterior-controls';

/** A reason the verdict is "Does not comply", with each space or application behind it. */
export interface VerdictReason {
  kind: ReasonKind;
  title: string;
  summary: string;
  link: WorkspaceLink;
  items: ReasonItem[];
}

const notMet = (lines: readonly ControlLine[]) => lines.filter((line) => line.status === 'not-met');
const plural = (count: number, one: string, many = `${one}s`) => `${count} ${count === 1 ? one : many}`;

function overWords(space: SpaceResult): string {
  return `${space.name}: ${formatWatts(String(-Number(space.marginW)))} over its allowance`;
}

/**
 * Every reason for "Does not comply", in the order the work goes: interior power (with the spaces
 * over allowance), interior controls (each space and control not met), exterior power (the
 * tradable pool or the application over), exterior controls (each application's control not met).
 * A control "to verify" is not a reason: the service does not fail the design on it.
 */
export function verdictReasons(result: EvaluationResult): VerdictReason[] {
  const reasons: VerdictReason[] = [];
  const interior = result.interior;
  if (!interior.complies) {
    const over = interior.spaces.filter((space) => space.lighting === 'entered' && !space.withinAllowance);
    reasons.push({
      kind: 'interior-power',
      title: 'Interior power over allowance',
      summary: `${formatWatts(String(-Number(interior.marginW)))} over the building's allowance; ${plural(over.length, 'space')} over their own`,
      link: { page: 'luminaires' },
      items: over.map((space) => ({ text: overWords(space), link: { page: 'spaces', query: { space: space.id } } })),
    });
  }
  // A space without luminaires waits out of the verdict (the open items name it), its lines with it.
  const interiorLines = interior.spaces
    .filter((space) => space.lighting !== 'none-entered')
    .flatMap((space) => notMet(space.controls).map((line) => ({ space, line })));
  if (interiorLines.length > 0) {
    reasons.push({
      kind: 'interior-controls',
      title: 'Interior controls not met',
      summary: `${plural(interiorLines.length, 'requirement')} in ${plural(new Set(interiorLines.map((entry) => entry.space.id)).size, 'space')}`,
      link: { page: 'controls' },
      items: interiorLines.map(({ space, line }) => ({
        text: `${space.name}: ${line.label} (${line.section || 'no section'})`,
        link: { page: 'controls', query: { space: space.id } },
      })),
    });
  }
  const exterior = result.exterior;
  if (exterior) {
    const items: ReasonItem[] = [];
    if (!exterior.tradable.complies) {
      items.push({
        text: `Tradable applications together: ${formatWatts(String(-Number(exterior.tradable.marginW)))} over their pooled allowance`,
        link: { page: 'exterior' },
      });
    }
    for (const application of exterior.applications.filter((entry) => !entry.tradable && !entry.withinAllowance)) {
      items.push({
        text: `${application.label}: ${formatWatts(String(-Number(application.marginW)))} over its own allowance`,
        link: { page: 'exterior' },
      });
    }
    if (!exterior.complies || items.length > 0) {
      reasons.push({
        kind: 'exterior-power',
        title: 'Exterior power over allowance',
        summary: `zone ${exterior.lightingZone}: ${plural(items.length, 'part')} over`,
        link: { page: 'exterior' },
        items,
      });
    }
    const exteriorLines = exterior.applications.flatMap((application) =>
      notMet(application.controls).map((line) => ({ application, line })),
    );
    if (exteriorLines.length > 0) {
      reasons.push({
        kind: 'exterior-controls',
        title: 'Exterior controls not met',
        summary: `${plural(exteriorLines.length, 'requirement')} on ${plural(new Set(exteriorLines.map((entry) => entry.application.key)).size, 'application')}`,
        link: { page: 'exterior' },
        items: exteriorLines.map(({ application, line }) => ({
          text: `${application.label}: ${line.label} ${statusView(line.status).words.toLowerCase()} (${line.section || 'no section'})`,
          link: { page: 'exterior' },
        })),
      });
    }
  }
  return reasons;
}

/** The spaces that hold the verdict back: no luminaires entered and not confirmed unlit. */
export function spacesWithoutLuminaires(result: EvaluationResult): SpaceResult[] {
  return result.interior.spaces.filter((space) => space.lighting === 'none-entered');
}

/** A control requirement the verdict waits for: provided, or checked against the adopted code, settles it. */
export interface OpenControl {
  spaceId: string | null;
  place: string;
  control: string;
  reason: string;
}

/**
 * The control lines marked "to verify" that hold the verdict back. A space without luminaires
 * waits as a whole, so its lines are not listed again here.
 */
export function controlsToVerify(result: EvaluationResult): OpenControl[] {
  const interior = result.interior.spaces
    .filter((space) => space.lighting !== 'none-entered')
    .flatMap((space) =>
      space.controls
        .filter((line) => line.status === 'to-verify')
        .map((line) => ({ spaceId: space.id, place: space.name, control: line.label, reason: line.reason })),
    );
  const exterior = (result.exterior?.applications ?? []).flatMap((application) =>
    application.controls
      .filter((line) => line.status === 'to-verify')
      .map((line) => ({ spaceId: null, place: application.label, control: line.label, reason: line.reason })),
  );
  return [...interior, ...exterior];
}

/** Why an incomplete design has no verdict, in a few words. */
export function openItemWords(result: EvaluationResult): string {
  const spaces = result.openItems.spacesWithoutLuminaires;
  const controls = result.openItems.controlsToVerify;
  return [
    spaces > 0 ? `${spaces === 1 ? '1 space' : `${spaces} spaces`} without luminaires` : '',
    controls > 0 ? `${controls === 1 ? '1 control' : `${controls} controls`} to verify` : '',
  ]
    .filter(Boolean)
    .join(', ');
}

/** The verdict's reasons in a few words, for the workspace's side panel. */
export function reasonTitles(result: EvaluationResult): string {
  return verdictReasons(result)
    .map((reason) => reason.title.replace(/ (over allowance|not met)$/, ''))
    .join(', ');
}
