import { Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import { openDB, type IDBPDatabase } from 'idb';
import { ApiError } from '../../core/http/api-error';
import { failureWords } from '../../shared/write-failure';
import type { FieldTestInput, RecordedFieldTest } from './field-tests-api';

/** At most this many results wait in the browser (our choice: a long day of tests on a large site); a further one is refused in words. */
export const queueLimit = 500;

/** One result taken without a connection, waiting in the browser to be sent. */
export interface QueuedResult {
  /** Made in the browser when the result was taken; the order of sending is `takenAt`, then `id`. */
  id: string;
  projectId: string;
  itemId: string;
  /** The item's title when the result was taken, for the words of a conflict. */
  itemTitle: string;
  input: FieldTestInput;
  /** When the result was taken (ISO). */
  takenAt: string;
  /** Set once sending it met a conflict: kept until the person dismisses it. */
  conflict?: { words: string; accepted: boolean };
}

/** Where the queue is kept: IndexedDB in the browser, memory where it has none. */
export interface QueueStorage {
  readonly lasting: boolean;
  all(): Promise<QueuedResult[]>;
  put(entry: QueuedResult): Promise<void>;
  remove(id: string): Promise<void>;
}

export class MemoryQueueStorage implements QueueStorage {
  readonly lasting = false;
  private readonly entries = new Map<string, QueuedResult>();

  all(): Promise<QueuedResult[]> {
    return Promise.resolve([...this.entries.values()].map((entry) => structuredClone(entry)));
  }

  put(entry: QueuedResult): Promise<void> {
    this.entries.set(entry.id, structuredClone(entry));
    return Promise.resolve();
  }

  remove(id: string): Promise<void> {
    this.entries.delete(id);
    return Promise.resolve();
  }
}

const storeName = 'results';

/** The queue in IndexedDB (`idb`), one database for every project of this browser. */
export class IdbQueueStorage implements QueueStorage {
  readonly lasting = true;
  private database: Promise<IDBPDatabase> | null = null;

  private open(): Promise<IDBPDatabase> {
    this.database ??= openDB('allowlight-field-tests', 1, {
      upgrade(database) {
        database.createObjectStore(storeName, { keyPath: 'id' });
      },
    });
    return this.database;
  }

  async all(): Promise<QueuedResult[]> {
    return (await (await this.open()).getAll(storeName)) as QueuedResult[];
  }

  async put(entry: QueuedResult): Promise<void> {
    await (await this.open()).put(storeName, entry);
  }

  async remove(id: string): Promise<void> {
    await (await this.open()).delete(storeName, id);
  }
}

export const QUEUE_STORAGE = new InjectionToken<QueueStorage>('field test queue storage', {
  providedIn: 'root',
  factory: () => (typeof indexedDB === 'undefined' ? new MemoryQueueStorage() : new IdbQueueStorage()),
});

/** Sends one queued result: the service's answer, or the error the request failed with. */
export type SendResult = (entry: QueuedResult) => Promise<RecordedFieldTest>;

/** The request failed for want of a connection, not by the service's refusal. */
export function isOffline(error: unknown): boolean {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return true;
  return error instanceof ApiError && error.status === 0;
}

function byTaking(a: QueuedResult, b: QueuedResult): number {
  return a.takenAt === b.takenAt ? (a.id < b.id ? -1 : a.id > b.id ? 1 : 0) : a.takenAt < b.takenAt ? -1 : 1;
}

function when(at: string): string {
  return new Date(at).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' });
}

/**
 * What sending a queued result met, in words, or null when the service took it plainly: a test of
 * the item recorded after this result was taken, other than the ones this browser just sent (`ours`).
 */
export function conflictWords(entry: QueuedResult, answer: RecordedFieldTest, ours: ReadonlySet<string>): string | null {
  const taken = Date.parse(entry.takenAt);
  const later = answer.item.history.filter((record) => !ours.has(record.id) && Date.parse(record.at) > taken);
  const last = later[later.length - 1];
  if (!last) return null;
  const by = last.by?.name ?? 'someone no longer on the team';
  return (
    `${entry.itemTitle}: ${by} recorded this item on ${when(last.at)}, after your result was taken on ${when(entry.takenAt)}. ` +
    'Both are kept in its history, yours as the latest (a retest): check which one stands.'
  );
}

/** A refusal of a queued result, in words. */
function refusalWords(entry: QueuedResult, error: unknown): string {
  if (error instanceof ApiError && error.status === 404) {
    return `${entry.itemTitle}: the item is no longer in the test plan (the design changed), so your result taken on ${when(entry.takenAt)} was not recorded.`;
  }
  return `${entry.itemTitle}: your result taken on ${when(entry.takenAt)} was not recorded. ${failureWords(error)}`;
}

/**
 * Results taken without a connection, kept in the browser and sent in the order they were taken.
 * An entry leaves the queue once the service took it plainly, or once the person dismissed what sending it met.
 */
@Injectable({ providedIn: 'root' })
export class FieldTestQueue {
  private readonly storage = inject(QUEUE_STORAGE);

  readonly entries = signal<QueuedResult[]>([]);
  /** Kept only while the page is open when the browser gives no IndexedDB. */
  readonly lasting = this.storage.lasting;
  private flushing: Promise<number> | null = null;
  private loaded: Promise<void> | null = null;

  readonly waiting = computed(() => this.entries().filter((entry) => !entry.conflict));
  readonly conflicts = computed(() => this.entries().filter((entry) => !!entry.conflict));

  /** Reads the stored queue (once; again after a write). */
  load(): Promise<void> {
    this.loaded ??= this.refresh();
    return this.loaded;
  }

  private async refresh(): Promise<void> {
    const all = await this.storage.all();
    this.entries.set(all.sort(byTaking));
  }

  /** Keeps a result to send later; false when the queue is full. */
  async add(entry: Omit<QueuedResult, 'id' | 'conflict'>): Promise<boolean> {
    await this.load();
    if (this.entries().length >= queueLimit) return false;
    const id = `${entry.takenAt}-${crypto.randomUUID()}`;
    await this.storage.put({ ...entry, itemTitle: entry.itemTitle.slice(0, 300), id });
    await this.refresh();
    return true;
  }

  async dismiss(id: string): Promise<void> {
    await this.storage.remove(id);
    await this.refresh();
  }

  /**
   * Sends the waiting results of a project in order, one at a time; stops at the first that finds no
   * connection (or a service that does not answer), to try again later. The number sent is the answer.
   */
  flush(projectId: string, send: SendResult): Promise<number> {
    this.flushing ??= this.sendAll(projectId, send).finally(() => (this.flushing = null));
    return this.flushing;
  }

  private async sendAll(projectId: string, send: SendResult): Promise<number> {
    await this.load();
    let sent = 0;
    const ours = new Set<string>();
    for (const entry of this.waiting().filter((candidate) => candidate.projectId === projectId)) {
      let answer: RecordedFieldTest;
      try {
        answer = await send(entry);
      } catch (error) {
        if (isOffline(error) || (error instanceof ApiError && error.status >= 500)) break;
        await this.storage.put({ ...entry, conflict: { words: refusalWords(entry, error), accepted: false } });
        continue;
      }
      sent += 1;
      if (answer.item.result) ours.add(answer.item.result.id);
      const words = conflictWords(entry, answer, ours);
      if (words) await this.storage.put({ ...entry, conflict: { words, accepted: true } });
      else await this.storage.remove(entry.id);
    }
    await this.refresh();
    return sent;
  }
}
