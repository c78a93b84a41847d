import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';

/** The kinds of functional test, as the service names them (shown only through `label` and the words below). */
export type TestKind =
  'occupant-sensor' | 'time-switch' | 'daylight' | 'light-reduction' | 'partial-off' | 'exterior-daylight-off' | 'exterior-setback';

export interface MeasuredValues {
  timeoutMinutes?: string;
  lightLevel?: string;
  overrideMinutes?: string;
}

/** One test or retest recorded in the field. */
export interface FieldTestRecord {
  id: string;
  itemId: string;
  result: 'pass' | 'fail';
  measured: MeasuredValues;
  /** The light level's unit when it was recorded. */
  lightLevelUnit: 'fc' | 'lux' | null;
  notes: string | null;
  by: { id: string; name: string } | null;
  at: string;
}

export interface TestPlanItem {
  id: string;
  kind: TestKind;
  title: string;
  spaceIds: string[];
  applicationKey?: string;
  combination?: string;
  sample: boolean;
  required: boolean;
  steps: string[];
  expected: string;
  section: string;
  result?: FieldTestRecord;
  history: FieldTestRecord[];
}

export interface TestPlanGroup {
  kind: TestKind;
  combination: string;
  population: number;
  sampleSize: number;
  widened: boolean;
  words: string;
  itemIds: string[];
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
  complete: boolean;
  kinds: KindProgress[];
}

export interface TestPlanView {
  items: TestPlanItem[];
  groups: TestPlanGroup[];
  gaps: string[];
  notices: string[];
  progress: TestProgress;
}

export interface FieldTestInput {
  result: 'pass' | 'fail';
  measured?: MeasuredValues;
  notes?: string;
}

export interface RecordedFieldTest {
  item: TestPlanItem;
  group?: TestPlanGroup;
  notices: string[];
  progress: TestProgress;
}

/** A project's functional test plan: members read it; the contractor records the tests. */
@Injectable({ providedIn: 'root' })
export class FieldTestsApi {
  private readonly http = inject(HttpClient);

  plan(projectId: string): Observable<TestPlanView> {
    return this.http.get<TestPlanView>(`/api/projects/${projectId}/test-plan`);
  }

  /** Item ids hold colons: encoded into the path. */
  record(projectId: string, itemId: string, input: FieldTestInput): Observable<RecordedFieldTest> {
    return this.http.patch<RecordedFieldTest>(`/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemId)}`, input);
  }
}
