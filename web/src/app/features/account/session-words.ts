/**
 * Sessions in words a person recognises: the browser and system read from the user agent, and
 * times relative to now. The patterns cover the common browsers only; anything else is named
 * plainly rather than guessed.
 */

// Order matters: Edge and Opera also announce Chrome, and Chrome also announces Safari.
const browsers: readonly (readonly [RegExp, string])[] = [
  [/\bEdg(?:e|A|iOS)?\//, 'Edge'],
  [/\b(?:OPR|Opera)\//, 'Opera'],
  [/\b(?:Firefox|FxiOS)\//, 'Firefox'],
  [/\b(?:HeadlessChrome|Chrome|Chromium|CriOS)\//, 'Chrome'],
  [/\bVersion\/[\d.]+.*\bSafari\//, 'Safari'],
];

// iPhone and iPad before macOS: their agents say "like Mac OS X"; Android before Linux likewise.
const systems: readonly (readonly [RegExp, string])[] = [
  [/\biPhone\b/, 'iPhone'],
  [/\biPad\b/, 'iPad'],
  [/\bAndroid\b/, 'Android'],
  [/\bCrOS\b/, 'ChromeOS'],
  [/\bWindows\b/, 'Windows'],
  [/\bMac OS X\b|\bMacintosh\b/, 'macOS'],
  [/\bLinux\b/, 'Linux'],
];

export type DeviceIcon = 'computer' | 'smartphone' | 'tablet';

export interface DeviceWords {
  /** "Firefox on Windows", "Safari on iPhone", "Unknown browser". */
  name: string;
  icon: DeviceIcon;
}

function first(patterns: readonly (readonly [RegExp, string])[], text: string): string | null {
  return patterns.find(([pattern]) => pattern.test(text))?.[1] ?? null;
}

export function describeDevice(userAgent: string | null): DeviceWords {
  const text = userAgent ?? '';
  const browser = first(browsers, text);
  const system = first(systems, text);
  const icon: DeviceIcon =
    system === 'iPad'
      ? 'tablet'
      : system === 'iPhone' || (system === 'Android' && /\bMobile\b/.test(text))
        ? 'smartphone'
        : system === 'Android'
          ? 'tablet'
          : 'computer';
  if (browser && system) return { name: `${browser} on ${system}`, icon };
  if (browser) return { name: browser, icon };
  if (system) return { name: `A browser on ${system}`, icon };
  return { name: 'Unknown browser', icon };
}

const relative = new Intl.RelativeTimeFormat('en', { numeric: 'auto' });
const calendar = new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric' });

/** "just now", "12 minutes ago", "yesterday"; a date once it is more than a week back. */
export function timeAgo(iso: string, now: Date): string {
  const seconds = Math.max(0, (now.getTime() - Date.parse(iso)) / 1000);
  if (seconds < 60) return 'just now';
  if (seconds < 3600) return relative.format(-Math.floor(seconds / 60), 'minute');
  if (seconds < 86_400) return relative.format(-Math.floor(seconds / 3600), 'hour');
  if (seconds < 7 * 86_400) return relative.format(-Math.floor(seconds / 86_400), 'day');
  return `on ${calendar.format(new Date(iso))}`;
}
