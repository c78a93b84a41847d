import type { ProjectState } from '../../core/api/api-types';

export const stateLabels: Record<ProjectState, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  returned: 'Returned',
  accepted: 'Accepted',
  issued: 'Issued',
};
