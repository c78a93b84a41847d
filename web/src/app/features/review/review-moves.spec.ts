import { movesFrom } from './review-moves';

describe('movesFrom', () => {
  const labels = (...args: Parameters<typeof movesFrom>) => movesFrom(...args).map((move) => move.label);

  it('offers the engineer submitting, submitting again and reopening, each from its own state only', () => {
    expect(labels('draft', 'engineer', false)).toEqual(['Submit for review']);
    expect(labels('returned', 'engineer', false)).toEqual(['Submit again']);
    expect(labels('in-review', 'engineer', false)).toEqual([]);
    expect(labels('accepted', 'engineer', false)).toEqual(['Reopen as a draft']);
    expect(labels('issued', 'engineer', false)).toEqual(['Reopen as a draft']);
  });

  it('offers the reviewer returning (with a comment) and accepting while in review, and nothing else', () => {
    expect(labels('in-review', 'reviewer', false)).toEqual(['Return to the engineer', 'Accept']);
    expect(movesFrom('in-review', 'reviewer', false)[0]!.asksComment).toBe(true);
    for (const state of ['draft', 'returned', 'accepted', 'issued'] as const) expect(labels(state, 'reviewer', false)).toEqual([]);
  });

  it('offers a contractor nothing, and an administrator every role’s moves', () => {
    for (const state of ['draft', 'in-review', 'returned', 'accepted', 'issued'] as const)
      expect(labels(state, 'contractor', false)).toEqual([]);
    expect(labels('in-review', null, true)).toEqual(['Return to the engineer', 'Accept']);
    expect(labels('draft', null, true)).toEqual(['Submit for review']);
  });
});
