import { sameWhereUnchanged } from './project-store';

// Invented records: only id and version matter here.
const record = (id: string, version: number, name: string) => ({ id, version, name });

describe('sameWhereUnchanged', () => {
  it('keeps the held copy of each record whose version did not move, and takes the new copy of the rest', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    const read = [record('a', 1, 'Exam 1'), record('b', 5, 'Exam 2, renamed')];
    const next = sameWhereUnchanged(held, read);
    expect(next[0]).toBe(held[0]);
    expect(next[1]).toBe(read[1]);
  });

  it('answers the held list itself when nothing changed, so nothing on screen starts again', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    expect(sameWhereUnchanged(held, [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')])).toBe(held);
  });

  it('follows additions, deletions and the order read', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    const read = [record('c', 1, 'Exam 3'), record('a', 1, 'Exam 1')];
    const next = sameWhereUnchanged(held, read);
    expect(next.map((item) => item.id)).toEqual(['c', 'a']);
    expect(next[1]).toBe(held[0]);
  });
});
