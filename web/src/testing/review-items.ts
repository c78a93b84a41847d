import type { ReviewItem } from '../../../contract/review';
import type { ProjectDetail, SpaceRecord } from '../app/core/api/api-types';

/** Invented project, spaces and check items for the review specs; the sections and figures are made up, not read from any edition. */
export const reviewProject = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'in-review',
  role: 'reviewer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 7,
  revision: 1,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;

export function reviewSpace(id: string, name: string): SpaceRecord {
  return {
    id,
    name,
    level: 'Level 1',
    position: 1,
    area: '400',
    spaceType: 'office-enclosed',
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    version: 1,
    updatedAt: '',
    updatedBy: null,
  };
}

export function reviewItem(id: string, overrides: Partial<ReviewItem> = {}): ReviewItem {
  return {
    id,
    kind: 'occupancy-sensing',
    spaceId: 's1',
    title: `Item ${id}`,
    section: 'Invented §1.2',
    outcome: 'met',
    reasoning: 'An occupant sensor is recorded for the space.',
    values: [{ label: 'Floor area', value: '400 ft²' }],
    verdict: null,
    changed: false,
    round: 1,
    thread: [],
    ...overrides,
  };
}
