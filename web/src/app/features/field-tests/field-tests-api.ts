import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { FieldTestInput, RecordedFieldTest, TestPlanView } from '../../../../../contract/field-tests';

export type {
  FieldTestInput,
  FieldTestRecord,
  KindProgress,
  MeasuredValues,
  RecordedFieldTest,
  TestKind,
  TestPlanGroup,
  TestPlanItemView as TestPlanItem,
  TestPlanView,
  TestProgress,
} from '../../../../../contract/field-tests';

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
