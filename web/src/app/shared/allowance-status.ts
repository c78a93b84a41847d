import type { SpaceResult } from '../core/api/api-types';
import { formatPercent, formatWatts } from './format';

export interface AllowanceStatus {
  within: boolean;
  icon: 'check_circle' | 'warning';
  label: 'Within allowance' | 'Over allowance';
  /** The margin in words: what is left, or the excess in watts. */
  words: string;
}

/**
 * A power status never shown by colour alone: an icon, the words, and the margin in words.
 * `marginW` is allowance − installed, so a negative margin is the excess.
 */
export function allowanceStatus(within: boolean, marginW: string, marginPct: string | null = null): AllowanceStatus {
  const margin = Number(marginW);
  if (within) {
    const share = marginPct === null ? '' : ` (${formatPercent(marginPct)})`;
    return { within, icon: 'check_circle', label: 'Within allowance', words: `${formatWatts(String(Math.abs(margin)))}${share} to spare` };
  }
  return { within, icon: 'warning', label: 'Over allowance', words: `${formatWatts(String(Math.abs(margin)))} over` };
}

/** A space's power status, which is no verdict at all until its lighting is entered or confirmed absent. */
export interface SpaceAllowanceStatus {
  kind: 'within' | 'over' | 'none-entered' | 'unlit';
  icon: string;
  label: string;
  /** What the status means or asks for, in words. */
  words: string;
  /** Over allowance: the only kind that counts against the verdict by itself. */
  over: boolean;
  /** The margin means something: luminaires are entered. */
  hasMargin: boolean;
}

export function spaceAllowanceStatus(
  space: Pick<SpaceResult, 'lighting' | 'withinAllowance' | 'marginW' | 'marginPct'>,
): SpaceAllowanceStatus {
  if (space.lighting === 'none-entered') {
    return {
      kind: 'none-entered',
      icon: 'pending',
      label: 'No luminaires entered',
      words: 'enter its luminaires, or confirm it is unlit',
      over: false,
      hasMargin: false,
    };
  }
  if (space.lighting === 'unlit') {
    return {
      kind: 'unlit',
      icon: 'dark_mode',
      label: 'Unlit (confirmed)',
      words: 'no lighting, so no allowance is counted',
      over: false,
      hasMargin: false,
    };
  }
  const status = allowanceStatus(space.withinAllowance, space.marginW, space.marginPct);
  return {
    kind: status.within ? 'within' : 'over',
    icon: status.icon,
    label: status.label,
    words: status.words,
    over: !status.within,
    hasMargin: true,
  };
}
