import type { FieldTestRecord, KindProgress, MeasuredValues, TestKind, TestPlanGroup, TestPlanItem, TestProgress } from './field-tests-api';

export type MeasuredField = keyof MeasuredValues;

/** What a measured field is called and its bounds: the service's (minutes 0–1,440, light level 0–100,000, two decimals). */
export const measuredFields: Record<MeasuredField, { label: string; max: number }> = {
  timeoutMinutes: { label: 'Time-out', max: 1440 },
  lightLevel: { label: 'Light level', max: 100_000 },
  overrideMinutes: { label: 'Override time', max: 1440 },
};

/**
 * Which measurements each kind of test asks for (our choice: what the test's steps time or read):
 * a sensor's or partial-off's time-out, a time switch's override, a light level where daylight or a
 * reduction is checked. Exterior setback is checked by the schedule, with notes.
 */
export const measuredByKind: Record<TestKind, MeasuredField[]> = {
  'occupant-sensor': ['timeoutMinutes'],
  'partial-off': ['timeoutMinutes'],
  'time-switch': ['overrideMinutes'],
  daylight: ['lightLevel'],
  'light-reduction': ['lightLevel'],
  'exterior-daylight-off': ['lightLevel'],
  'exterior-setback': [],
};

export function lightUnit(units: string): 'fc' | 'lux' {
  return units === 'si' ? 'lux' : 'fc';
}

function figure(value: string): string {
  const number = Number(value);
  return Number.isFinite(number) ? number.toLocaleString('en-US', { maximumFractionDigits: 2 }) : value;
}

/** A test's measurements in words, with units: “time-out 12 minutes, light level 30 fc”. */
export function measuredWords(record: FieldTestRecord): string {
  const parts: string[] = [];
  const { timeoutMinutes, lightLevel, overrideMinutes } = record.measured;
  if (timeoutMinutes !== undefined) parts.push(`time-out ${figure(timeoutMinutes)} minutes`);
  if (lightLevel !== undefined) parts.push(`light level ${figure(lightLevel)} ${record.lightLevelUnit ?? 'fc'}`);
  if (overrideMinutes !== undefined) parts.push(`override ${figure(overrideMinutes)} minutes`);
  return parts.join(', ');
}

export function resultWords(result: 'pass' | 'fail'): string {
  return result === 'pass' ? 'Passed' : 'Failed';
}

/** A group's size in words: “3 of 24 in the sample”, or all of them once widened. */
export function groupWords(group: TestPlanGroup): string {
  const count = (n: number) => `${n.toLocaleString('en-US')} ${n === 1 ? 'control' : 'controls'}`;
  if (group.widened) return `${count(group.population)}: the sample widened, every one of them is to be tested.`;
  if (group.sampleSize >= group.population) return `${count(group.population)}: each one is tested.`;
  return `${count(group.population)}: ${group.sampleSize.toLocaleString('en-US')} in the sample.`;
}

/** Progress in words: “5 of 8 passed, 1 failed, 2 not tested yet”. */
export function progressWords(progress: TestProgress | KindProgress): string {
  if (progress.required === 0) return 'Nothing to test.';
  const parts = [`${progress.passed} of ${progress.required} passed`];
  if (progress.failed > 0) parts.push(`${progress.failed} failed`);
  if (progress.untested > 0) parts.push(`${progress.untested} not tested yet`);
  return parts.join(', ') + '.';
}

export function progressPercent(progress: TestProgress | KindProgress): number {
  return progress.required === 0 ? 0 : Math.round((progress.passed / progress.required) * 100);
}

/** A typed measurement checked as the service checks it; the words say what is wrong. */
export function checkMeasured(field: MeasuredField, text: string): { ok: true; value?: string } | { ok: false; message: string } {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: true };
  const { label, max } = measuredFields[field];
  if (!/^\d+(\.\d+)?$/.test(trimmed)) return { ok: false, message: `${label}: give a number, 0 or more.` };
  if (/\.\d{3,}$/.test(trimmed)) return { ok: false, message: `${label}: at most two decimal places.` };
  if (Number(trimmed) > max) return { ok: false, message: `${label}: at most ${max.toLocaleString('en-US')}.` };
  return { ok: true, value: trimmed };
}

/** Which tests the page shows: all of them, those still to do (required and not passed), or by their latest result. */
export type TestFilter = 'all' | 'to-do' | 'failed' | 'passed';

export const testFilters: readonly { value: TestFilter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'to-do', label: 'To do' },
  { value: 'failed', label: 'Failed' },
  { value: 'passed', label: 'Passed' },
];

/** The longest search the page reads: a space's name or a test's title fits well within it. */
export const searchLimit = 100;

type FilteredItem = Pick<TestPlanItem, 'required' | 'result'>;

/** Whether an item is among those a filter shows; “to do” is what testing still needs: untested or failed, and required. */
export function filterMatches(item: FilteredItem, filter: TestFilter): boolean {
  switch (filter) {
    case 'all':
      return true;
    case 'to-do':
      return item.required && item.result?.result !== 'pass';
    case 'failed':
      return item.result?.result === 'fail';
    case 'passed':
      return item.result?.result === 'pass';
  }
}

/** A search as typed, ready to compare: trimmed, bounded, lower case, spaces run together. */
export function searchTerms(text: string): string {
  return text.slice(0, searchLimit).trim().replace(/\s+/g, ' ').toLocaleLowerCase('en-US');
}

/** Whether an item's title, its combination or one of its spaces' names holds the search (already through `searchTerms`). */
export function searchMatches(item: Pick<TestPlanItem, 'title' | 'combination'>, spaceNames: readonly string[], terms: string): boolean {
  if (terms === '') return true;
  const holds = (text: string | undefined) => !!text && text.replace(/\s+/g, ' ').toLocaleLowerCase('en-US').includes(terms);
  return holds(item.title) || holds(item.combination) || spaceNames.some(holds);
}
