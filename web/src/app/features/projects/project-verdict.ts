import type { EvaluationResult } from '../../core/api/api-types';

/** One project's interior verdict as the list shows it; `pending` until its results arrive. */
export type ProjectVerdict =
  | { status: 'pending' }
  | { status: 'complies'; marginPct: string | null }
  | { status: 'does-not-comply'; marginPct: string | null }
  | { status: 'incomplete' };

export function verdictOf(result: EvaluationResult): ProjectVerdict {
  return result.verdict === 'incomplete' ? { status: 'incomplete' } : { status: result.verdict, marginPct: result.interior.marginPct };
}
