/** The exterior lighting's astronomical schedule as the service answers it and the web app reads it. */

/** The schedule's settings: offsets in minutes, the setback window as local HH:MM (null: no setback). */
export interface ExteriorScheduleSettings {
  onMinutesBeforeSunset: number;
  offMinutesAfterSunrise: number;
  setback: { start: string; end: string; reductionPercent?: number } | null;
}

/** Whether the Sun rises and sets on a day, or stays below or above the horizon all day long. */
export type SunPattern = 'rises-and-sets' | 'sun-never-rises' | 'sun-never-sets';

export interface ScheduleDay {
  /** The local date, YYYY-MM-DD. */
  date: string;
  /** Local ISO 8601 with the zone's offset at that moment, to the minute; null when the Sun does not rise (or set) this day. */
  sunrise: string | null;
  sunset: string | null;
  /** Lights on (before sunset) and off (after sunrise) by the schedule; null on a day without sunset or sunrise. */
  on: string | null;
  off: string | null;
  /** The setback window that begins this day, when the schedule has one. */
  setbackStart?: string;
  setbackEnd?: string;
  sun: SunPattern;
  /** The zone's offset from UTC at the start of the day and at its end, e.g. "-05:00"; they differ on a change day. */
  utcOffset: string;
  /** Said on a day the clocks change and on a polar day or night, in words. */
  note?: string;
  /** Minutes of this local day (midnight to midnight) the lights are on, and how many of those fall in the setback window. */
  litMinutes: number;
  setbackMinutes: number;
}

/** What the edition asks of an application in the setback hours. */
export type SetbackRule = 'off' | 'reduced' | 'none' | 'to-verify';

export interface ApplicationEnergy {
  id: string;
  key: string;
  label: string;
  description?: string;
  installedWatts: string;
  setback: SetbackRule;
  /** The share of the power cut in the setback hours, %; 0 when none applies. */
  reductionPercent: string;
  /** The section that states the setback rule; absent when none applies. */
  section?: string;
  /** Hours the lights are on in the range, and of those in the setback window. */
  hours: string;
  setbackHours: string;
  /** kWh with the setback (what the schedule uses), without it, and the difference. */
  kWh: string;
  kWhWithoutSetback: string;
  savingKWh: string;
  /** In words: what the rule is and where it comes from, or what is to verify. */
  note: string;
  verified: boolean;
}

/** How the schedule stands against one of the code's exterior control requirements. */
export type ScheduleCheckStatus = 'met' | 'not-met' | 'to-verify' | 'exception' | 'not-required';

/** One exterior application's daylight shutoff or night setback, checked against the project's schedule. */
export interface ScheduleCheck {
  check: 'daylight-off' | 'setback';
  applicationId: string;
  /** The application's name in the edition, as the result names it. */
  label: string;
  status: ScheduleCheckStatus;
  /** The section that states the requirement; absent when none applies. */
  section?: string;
  /** What the schedule does and what the code asks, in words; for "to verify", what to check. */
  words: string;
  /** False where the requirement rests on values not checked against the published code. */
  verified: boolean;
}

/** `GET /api/projects/:id/exterior-schedule/settings`, and the answer to saving them. */
export interface StoredExteriorSchedule {
  settings: ExteriorScheduleSettings;
  /** 0 until the project saves a schedule (the defaults run until then); each save adds one. */
  version: number;
  saved: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
}

export interface ScheduleSummary {
  from: string;
  days: number;
  settings: ExteriorScheduleSettings;
  /** Hours the lights are on over the range, and of those in the setback window. */
  hours: string;
  setbackHours: string;
  /** Days the sun does not rise, and days it does not set. */
  polarNightDays: number;
  polarDays: number;
  applications: ApplicationEnergy[];
  totals: { installedWatts: string; kWh: string; kWhWithoutSetback: string; savingKWh: string };
  /** The exterior control requirements the schedule answers, per application. */
  checks: ScheduleCheck[];
  /** Values the result rests on that are not checked against the published code, in words. */
  unverified: string[];
}
