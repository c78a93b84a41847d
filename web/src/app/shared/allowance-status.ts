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
