import { reviewItem } from '../../../testing/review-items';
import { ageInDays, countsByKind, groupItems, stepItem } from './review-items';

const spaces = [
  { id: 's1', name: 'Hose store' },
  { id: 's2', name: 'Office' },
];
const items = [
  reviewItem('a', { kind: 'occupancy-sensing', spaceId: 's2' }),
  reviewItem('b', { kind: 'power-allowance', spaceId: 's1', verdict: 'needs-revision' }),
  reviewItem('c', { kind: 'exterior-power', spaceId: undefined, verdict: 'confirmed' }),
  reviewItem('d', { kind: 'occupancy-sensing', spaceId: 's1' }),
  reviewItem('e', { kind: 'daylight-response', spaceId: 'gone' }),
];

describe('groupItems', () => {
  it('groups by kind in the order the checks go, leaving out kinds without items', () => {
    const groups = groupItems(items, 'kind', spaces);
    expect(groups.map((group) => group.label)).toEqual(['Power allowance', 'Occupancy sensing', 'Daylight response', 'Exterior power']);
    expect(groups[1]!.items.map((item) => item.id)).toEqual(['a', 'd']);
  });

  it('groups by space in the design’s order, then items of spaces no longer there, then the site', () => {
    const groups = groupItems(items, 'space', spaces);
    expect(groups.map((group) => group.label)).toEqual(['Hose store', 'Office', 'Spaces no longer in the design', 'Site']);
    expect(groups[0]!.items.map((item) => item.id)).toEqual(['b', 'd']);
    expect(groups.flatMap((group) => group.items)).toHaveLength(items.length);
  });
});

describe('stepItem', () => {
  it('moves to the next and previous item and stays put at either end', () => {
    expect(stepItem(items, 'a', 1)).toBe('b');
    expect(stepItem(items, 'b', -1)).toBe('a');
    expect(stepItem(items, 'a', -1)).toBe('a');
    expect(stepItem(items, 'e', 1)).toBe('e');
  });

  it('starts at the first (or, going back, the last) item when none is chosen, and answers null for no items', () => {
    expect(stepItem(items, null, 1)).toBe('a');
    expect(stepItem(items, null, -1)).toBe('e');
    expect(stepItem([], null, 1)).toBeNull();
  });
});

describe('countsByKind', () => {
  it('counts the items without a verdict and those that need revision, per kind, leaving out settled kinds', () => {
    expect(countsByKind(items)).toEqual([
      { kind: 'power-allowance', label: 'Power allowance', open: 0, needsRevision: 1 },
      { kind: 'occupancy-sensing', label: 'Occupancy sensing', open: 2, needsRevision: 0 },
      { kind: 'daylight-response', label: 'Daylight response', open: 1, needsRevision: 0 },
    ]);
  });
});

describe('ageInDays', () => {
  it('counts whole days, never below zero', () => {
    const now = new Date('2026-03-10T12:00:00Z');
    expect(ageInDays('2026-03-07T13:00:00Z', now)).toBe(2);
    expect(ageInDays('2026-03-10T11:00:00Z', now)).toBe(0);
    expect(ageInDays('2026-03-11T09:00:00Z', now)).toBe(0);
  });
});
