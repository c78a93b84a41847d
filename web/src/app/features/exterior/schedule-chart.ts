import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ExteriorScheduleDay, SunPattern } from '../../core/api/api-types';

/**
 * The year of the astronomical schedule as a picture of our own: one column per day, running from
 * noon to the next noon, lit from the on time to the next morning's off time, the part inside the
 * setback window darker. The clock changes show as steps of an hour in both edges, marked; runs of
 * days without sunrise or sunset are labelled in words.
 */

const dayMinutes = 24 * 60;

/** Minutes after noon of `date` at which a local ISO time falls (the next day's morning is past 720). */
export function minutesAfterNoon(iso: string, date: string): number {
  const days = Math.round((Date.parse(`${iso.slice(0, 10)}T00:00:00Z`) - Date.parse(`${date}T00:00:00Z`)) / 86_400_000);
  return days * dayMinutes + Number(iso.slice(11, 13)) * 60 + Number(iso.slice(14, 16)) - 12 * 60;
}

export interface ChartColumn {
  date: string;
  index: number;
  /** The night's lit stretch, minutes after noon; null when the lights stay off. */
  lit: [number, number] | null;
  /** The parts of the lit stretch inside the setback window. */
  setback: [number, number][];
}

export interface ChartRun {
  sun: Exclude<SunPattern, 'rises-and-sets'>;
  first: number;
  last: number;
  words: string;
}

export interface ChartChange {
  index: number;
  words: string;
}

export interface ScheduleChartData {
  columns: ChartColumn[];
  runs: ChartRun[];
  changes: ChartChange[];
  /** The first day of each month, for the axis. */
  months: { index: number; label: string }[];
}

const monthLabels = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

export function shortDate(date: string): string {
  return `${Number(date.slice(8, 10))} ${monthLabels[Number(date.slice(5, 7)) - 1]}`;
}

function nightOf(day: ExteriorScheduleDay, next: ExteriorScheduleDay | undefined): [number, number] | null {
  const start = day.on !== null ? minutesAfterNoon(day.on, day.date) : day.sun === 'sun-never-rises' ? 0 : null;
  if (start === null) return null;
  // The last day of the range has no next morning: its own morning, a day on, stands in for it.
  const morning = next ?? { ...day, off: day.off === null ? null : `${nextDate(day.date)}${day.off.slice(10)}` };
  const end =
    morning.off !== null ? minutesAfterNoon(morning.off, day.date) : morning.sun === 'sun-never-rises' ? dayMinutes : Math.max(start, 0);
  const from = Math.max(0, Math.min(start, dayMinutes));
  const to = Math.max(0, Math.min(end, dayMinutes));
  return to > from ? [from, to] : null;
}

function nextDate(date: string): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
}

function windowOf(day: ExteriorScheduleDay | undefined, date: string): [number, number] | null {
  if (!day?.setbackStart || !day.setbackEnd) return null;
  return [minutesAfterNoon(day.setbackStart, date), minutesAfterNoon(day.setbackEnd, date)];
}

export function scheduleChart(days: readonly ExteriorScheduleDay[]): ScheduleChartData {
  const columns = days.map((day, index): ChartColumn => {
    const lit = nightOf(day, days[index + 1]);
    const windows = [windowOf(day, day.date), windowOf(days[index + 1], day.date)].filter((window) => window !== null);
    const setback = lit
      ? windows
          .map(([start, end]) => [Math.max(start, lit[0]), Math.min(end, lit[1])] as [number, number])
          .filter(([start, end]) => end > start)
      : [];
    return { date: day.date, index, lit, setback };
  });

  const runs: ChartRun[] = [];
  days.forEach((day, index) => {
    if (day.sun === 'rises-and-sets') return;
    const open = runs.at(-1);
    if (open && open.sun === day.sun && open.last === index - 1) open.last = index;
    else runs.push({ sun: day.sun, first: index, last: index, words: '' });
  });
  for (const run of runs) {
    const span =
      run.first === run.last
        ? shortDate(days[run.first]!.date)
        : `${shortDate(days[run.first]!.date)} – ${shortDate(days[run.last]!.date)}`;
    run.words = run.sun === 'sun-never-rises' ? `No sunrise ${span}: lights on all day` : `No sunset ${span}: lights off`;
  }

  const changes = days.flatMap((day, index): ChartChange[] => {
    if (!day.utcOffset.includes(' to ')) return [];
    const [before, after] = day.utcOffset.split(' to ') as [string, string];
    const forward = offsetMinutes(after) > offsetMinutes(before);
    return [{ index, words: `${shortDate(day.date)}: clocks ${forward ? 'forward' : 'back'} an hour` }];
  });

  const months = days.flatMap((day, index) =>
    day.date.endsWith('-01') ? [{ index, label: monthLabels[Number(day.date.slice(5, 7)) - 1]! }] : [],
  );
  return { columns, runs, changes, months };
}

function offsetMinutes(offset: string): number {
  const sign = offset.startsWith('-') ? -1 : 1;
  return sign * (Number(offset.slice(1, 3)) * 60 + Number(offset.slice(4, 6)));
}

/** Plot geometry in the SVG's own units. */
const plot = { left: 44, top: 12, columnWidth: 2, minuteHeight: 0.25 };
const hourTicks = [0, 6, 12, 18, 24].map((hours) => ({
  y: plot.top + hours * 60 * plot.minuteHeight,
  label: ['12:00', '18:00', '00:00', '06:00', '12:00'][hours / 6]!,
}));

@Component({
  selector: 'al-schedule-chart',
  templateUrl: './schedule-chart.html',
  styleUrl: './schedule-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScheduleChart {
  readonly days = input.required<readonly ExteriorScheduleDay[]>();
  readonly year = input.required<number>();

  protected readonly plot = plot;
  protected readonly hourTicks = hourTicks;
  protected readonly chart = computed(() => scheduleChart(this.days()));
  protected readonly plotWidth = computed(() => this.days().length * plot.columnWidth);
  protected readonly plotHeight = dayMinutes * plot.minuteHeight;
  protected readonly width = computed(() => plot.left + this.plotWidth() + 8);
  protected readonly height = plot.top + dayMinutes * plot.minuteHeight + 28;
  protected readonly label = computed(() => {
    const chart = this.chart();
    const parts = [
      `Exterior lights through ${this.year()}: on from before sunset to after sunrise, each day a column from noon to the next noon.`,
      ...chart.changes.map((change) => `${change.words}.`),
      ...chart.runs.map((run) => `${run.words}.`),
    ];
    return parts.join(' ');
  });

  protected x(index: number): number {
    return plot.left + index * plot.columnWidth;
  }

  protected y(minutes: number): number {
    return plot.top + minutes * plot.minuteHeight;
  }
}
