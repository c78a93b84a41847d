import type { FieldTestSummary } from '../../../../../contract/field-tests';

/** How the project list and the state bar say where the field tests stand. */
export interface FieldTestStatus {
  complete: boolean;
  /** Short, for a chip or the state bar: “Testing complete”, “Field tests: 3 of 12 passed, 1 failed”. */
  words: string;
  /** When the last required test passed, once testing is complete. */
  completedAt: string | null;
}

/** Nothing to say before any test is recorded, after a design change, or when the plan has nothing to test. */
export function fieldTestStatus(summary: FieldTestSummary | null | undefined): FieldTestStatus | null {
  if (!summary || summary.required === 0) return null;
  if (summary.complete) return { complete: true, words: 'Testing complete', completedAt: summary.completedAt };
  const parts = [`${summary.passed} of ${summary.required} passed`];
  if (summary.failed > 0) parts.push(`${summary.failed} failed`);
  return { complete: false, words: `Field tests: ${parts.join(', ')}`, completedAt: null };
}
