/** The functional test plan and its field record, as the service answers them and the web app reads them. */

export const testKinds = [
  'occupant-sensor',
  'time-switch',
  'daylight',
  'light-reduction',
  'partial-off',
  'exterior-daylight-off',
  'exterior-setback',
] as const;
/** The kinds of functional test (shown to people only through `testKindLabels`). */
export type TestKind = (typeof testKinds)[number];

export const testKindLabels: Record<TestKind, string> = {
  'occupant-sensor': 'Occupant sensors',
  'time-switch': 'Time switches',
  daylight: 'Daylight-responsive controls',
  'light-reduction': 'Light reduction',
  'partial-off': 'Automatic partial off',
  'exterior-daylight-off': 'Exterior daylight off',
  'exterior-setback': 'Exterior setback and shutoff',
};

export interface MeasuredValues {
  timeoutMinutes?: string;
  lightLevel?: string;
  overrideMinutes?: string;
}

/** One recorded test of a plan item, as the plan shows it in the item's history. */
export interface FieldTestRecord {
  id: string;
  itemId: string;
  result: 'pass' | 'fail';
  measured: MeasuredValues;
  /** 'fc' or 'lux': the light level's unit, from the project's units when it was recorded. */
  lightLevelUnit: 'fc' | 'lux' | null;
  notes: string | null;
  by: { id: string; name: string } | null;
  at: string;
}

/** One test of the plan, as the design makes it. */
export interface TestPlanItem {
  /** Stable: the kind, the strategy, the space or application key (and the room, for a grouped entry). */
  id: string;
  kind: TestKind;
  /** What is tested, in words: “Occupant sensor in 201 Makerspace”. */
  title: string;
  spaceIds: string[];
  /** The exterior application's key, for an exterior item. */
  applicationKey?: string;
  /** The occupant sensors' combination (sensor type and space geometry) this item belongs to. */
  combination?: string;
  /** Chosen for the sample (every item that is not an occupant sensor in a sampled combination is). */
  sample: boolean;
  /** Must be tested: in the sample, or its combination widened after failures. */
  required: boolean;
  steps: string[];
  expected: string;
  section: string;
}

export interface TestPlanGroup {
  kind: TestKind;
  /** In words: “ceiling dual technology occupant sensor · Office — enclosed · up to 300 ft²”, or “each one”. */
  combination: string;
  population: number;
  sampleSize: number;
  widened: boolean;
  /** Why the sample widened, or how it was chosen, in words. */
  words: string;
  itemIds: string[];
}

/** The most photos one plan item keeps. */
export const photosPerItem = 20;
/** The largest photo accepted, in bytes (10 MB). */
export const photoMaxBytes = 10 * 1024 * 1024;
/** The longest caption, in characters. */
export const photoCaptionMax = 300;

/** A photo of a plan item, as the plan lists it; its copies are read at `…/photos/:id?size=thumb|display|original`. */
export interface FieldTestPhoto {
  id: string;
  caption: string | null;
  at: string;
  by: { id: string; name: string } | null;
  /** The display copy's size in pixels. */
  width: number;
  height: number;
  /** The test the item had when the photo was added, if any. */
  resultId: string | null;
}

/** A plan item with what the field record holds for it. */
export interface TestPlanItemView extends TestPlanItem {
  /** The item's photos, oldest first. */
  photos: FieldTestPhoto[];
  /** The latest test, which counts; absent until the item is tested. */
  result?: FieldTestRecord;
  /** Every test of the item, oldest first. */
  history: FieldTestRecord[];
}

export interface KindProgress {
  kind: TestKind;
  label: string;
  required: number;
  passed: number;
  failed: number;
  untested: number;
}

export interface TestProgress {
  required: number;
  passed: number;
  failed: number;
  untested: number;
  /** Every required item has passed: testing is complete. */
  complete: boolean;
  kinds: KindProgress[];
}

/** `GET /api/projects/:id/test-plan`. */
export interface TestPlanView {
  items: TestPlanItemView[];
  groups: TestPlanGroup[];
  /** Controls the design requires but does not show as provided: nothing to test until they are. */
  gaps: string[];
  /** The widened samples' words and the gaps, for the top of the page. */
  notices: string[];
  progress: TestProgress;
}

/** `PATCH /api/projects/:id/test-plan/items/:itemId`. */
export interface FieldTestInput {
  result: 'pass' | 'fail';
  measured?: MeasuredValues;
  notes?: string;
}

/** The answer to a recorded test: the item again, its group (a widened sample shows), the notices and progress. */
export interface RecordedFieldTest {
  item: TestPlanItemView;
  group?: TestPlanGroup;
  notices: string[];
  progress: TestProgress;
}

/**
 * Where the project's field tests stand, as the project list and the state bar show it: kept on
 * the project each time its plan is read, and dropped when the design changes (the plan is then
 * made again from the new design before anything is said about it).
 */
export interface FieldTestSummary {
  required: number;
  passed: number;
  failed: number;
  untested: number;
  /** Every required item has passed. */
  complete: boolean;
  /** When the last required item passed, once testing is complete. */
  completedAt: string | null;
}

/**
 * Where the plan stands, in the few figures the project list and the state bar show; once every
 * required item has passed, when: the latest of their passing results (a later test of an item
 * outside the sample does not move it).
 */
export function fieldTestSummaryOf(view: Pick<TestPlanView, 'items' | 'progress'>): FieldTestSummary {
  const { required, passed, failed, untested, complete } = view.progress;
  let completedAt: string | null = null;
  if (complete) {
    for (const item of view.items) {
      if (!item.required || item.result?.result !== 'pass') continue;
      if (completedAt === null || Date.parse(item.result.at) > Date.parse(completedAt)) completedAt = item.result.at;
    }
  }
  return { required, passed, failed, untested, complete, completedAt };
}
