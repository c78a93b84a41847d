import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { ApiError } from '../../core/http/api-error';
import type { FieldTestRecord, RecordedFieldTest, TestPlanItem } from './field-tests-api';
import { FieldTestQueue, MemoryQueueStorage, QUEUE_STORAGE, queueLimit, type QueuedResult } from './field-test-queue';

// Invented items and people: the queue's logic against its in-memory storage; the browser test covers IndexedDB.
function record(id: string, at: string, by: string | null = 'Tomas Reyes'): FieldTestRecord {
  return { id, itemId: 'i1', result: 'pass', measured: {}, lightLevelUnit: null, notes: null, by: by ? { id: by, name: by } : null, at };
}

function answer(history: FieldTestRecord[]): RecordedFieldTest {
  const item = { id: 'i1', history, result: history[history.length - 1] } as unknown as TestPlanItem;
  return { item, notices: [], progress: { required: 1, passed: 1, failed: 0, untested: 0, complete: true, kinds: [] } };
}

describe('FieldTestQueue', () => {
  let storage: MemoryQueueStorage;
  let queue: FieldTestQueue;

  beforeEach(() => {
    storage = new MemoryQueueStorage();
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection(), { provide: QUEUE_STORAGE, useValue: storage }] });
    queue = TestBed.inject(FieldTestQueue);
  });

  const take = (itemId: string, takenAt: string, projectId = 'p1') =>
    queue.add({ projectId, itemId, itemTitle: `Test ${itemId}`, input: { result: 'pass' }, takenAt });

  it('sends in the order taken, removes what the service took, and stops with the rest kept when the connection fails', async () => {
    await take('b', '2026-03-02T10:05:00Z');
    await take('a', '2026-03-02T10:00:00Z');
    await take('c', '2026-03-02T10:10:00Z');
    await take('x', '2026-03-02T09:00:00Z', 'p2');
    expect(queue.waiting().length).toBe(4);
    const sentItems: string[] = [];
    let n = 0;
    const sent = await queue.flush('p1', (entry: QueuedResult) => {
      sentItems.push(entry.itemId);
      n += 1;
      if (entry.itemId === 'b') return Promise.reject(new ApiError(0, 'offline', 'The service cannot be reached.'));
      return Promise.resolve(answer([record(`r${n}`, '2026-03-02T11:00:00Z')]));
    });
    expect(sent).toBe(1);
    expect(sentItems).toEqual(['a', 'b']);
    expect(queue.waiting().map((entry) => entry.itemId)).toEqual(['x', 'b', 'c']);
    expect((await storage.all()).length).toBe(3);
  });

  it('keeps a result the plan no longer has, and a refusal, in words until dismissed; the next ones are still sent', async () => {
    await take('gone', '2026-03-02T10:00:00Z');
    await take('bad', '2026-03-02T10:01:00Z');
    await take('fine', '2026-03-02T10:02:00Z');
    const sent = await queue.flush('p1', (entry) => {
      if (entry.itemId === 'gone') return Promise.reject(new ApiError(404, 'not_found', 'Not found.'));
      if (entry.itemId === 'bad')
        return Promise.reject(new ApiError(409, 'archived', 'The project is archived: nothing in it can change.'));
      return Promise.resolve(answer([record('r1', '2026-03-02T11:00:00Z')]));
    });
    expect(sent).toBe(1);
    expect(queue.waiting()).toEqual([]);
    const words = queue.conflicts().map((entry) => entry.conflict?.words ?? '');
    expect(words[0]).toMatch(
      /^Test gone: the item is no longer in the test plan \(the design changed\), so your result taken on .+ was not recorded\.$/,
    );
    expect(words[1]).toContain('Test bad: your result taken on');
    expect(words[1]).toContain('The project is archived: nothing in it can change.');
    expect(words.join(' ')).not.toMatch(/404|409|not_found/);
    // Not sent again.
    expect(await queue.flush('p1', () => Promise.reject(new Error('sent again')))).toBe(0);
    await queue.dismiss(queue.conflicts()[0]!.id);
    expect(queue.conflicts().map((entry) => entry.itemId)).toEqual(['bad']);
    expect((await storage.all()).length).toBe(1);
  });

  it('tells the person when someone recorded the item after the queued result was taken, but not for its own earlier queued result', async () => {
    await take('i1', '2026-03-02T10:00:00Z');
    await take('i1', '2026-03-02T10:30:00Z');
    const earlier = record('r0', '2026-03-02T09:00:00Z', 'Ana Ortiz');
    const someone = record('r1', '2026-03-02T10:20:00Z', 'Ana Ortiz');
    const histories = [
      [earlier, someone, record('r2', '2026-03-02T12:00:00Z')],
      [earlier, someone, record('r2', '2026-03-02T12:00:00Z'), record('r3', '2026-03-02T12:00:01Z')],
    ];
    let n = 0;
    expect(await queue.flush('p1', () => Promise.resolve(answer(histories[n++]!)))).toBe(2);
    expect(queue.waiting()).toEqual([]);
    // The first was taken before Ana's test; the second after it, and after only its own queue's r2.
    expect(queue.conflicts().length).toBe(1);
    const conflict = queue.conflicts()[0]!;
    expect(conflict.takenAt).toBe('2026-03-02T10:00:00Z');
    expect(conflict.conflict?.accepted).toBe(true);
    expect(conflict.conflict?.words).toMatch(
      /^Test i1: Ana Ortiz recorded this item on .+, after your result was taken on .+\. Both are kept/,
    );
  });

  it(`keeps at most ${queueLimit} results and refuses one more`, async () => {
    for (let i = 0; i < queueLimit; i += 1) {
      await storage.put({
        id: `e${i}`,
        projectId: 'p1',
        itemId: `i${i}`,
        itemTitle: 't',
        input: { result: 'pass' },
        takenAt: '2026-03-02T10:00:00Z',
      });
    }
    expect(await take('one-more', '2026-03-02T11:00:00Z')).toBe(false);
    expect(queue.entries().length).toBe(queueLimit);
  });
});
