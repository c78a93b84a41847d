import type { Response } from 'express';
import pg from 'pg';
import type { Logger } from 'pino';

/**
 * Who is watching which project, and the one PostgreSQL connection that hears about changes.
 *
 * Every audited write notifies the channel below in its own transaction (`recordAudit`), so a
 * change is announced when it commits and never when it rolls back, whichever process made it.
 * The listening connection opens with the first watcher and closes with the last.
 */
export const changeChannel = 'project_changes';

/** What a watcher learns: which project changed, what kind of thing, and how. No design data. */
export interface ProjectChange {
  projectId: string;
  entity: string;
  action: string;
}

/** A comment line every so often keeps proxies from closing a quiet stream. */
const heartbeatMs = 25_000;

export class ProjectChanges {
  private readonly watchers = new Map<string, Set<Response>>();
  private client: pg.Client | null = null;
  private connecting: Promise<void> | null = null;
  private heartbeat: NodeJS.Timeout | null = null;

  constructor(
    private readonly connection: string | pg.ClientConfig,
    private readonly logger?: Logger,
  ) {}

  /** Opens a server-sent event stream on `res` for one project; it ends when the client goes. */
  async watch(projectId: string, res: Response): Promise<void> {
    await this.listen();
    // A client that went while the listener was connecting is not counted; the last one out closes it.
    if (res.destroyed || res.writableEnded) {
      if (this.watchers.size === 0) await this.stop();
      return;
    }
    res.status(200);
    res.setHeader('Content-Type', 'text/event-stream; charset=utf-8');
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Accel-Buffering', 'no');
    res.flushHeaders();
    // A client that loses the stream tries again after 3 s.
    res.write('retry: 3000\n\n');
    res.write('event: ready\ndata: {}\n\n');
    const set = this.watchers.get(projectId) ?? new Set<Response>();
    set.add(res);
    this.watchers.set(projectId, set);
    res.on('close', () => {
      set.delete(res);
      if (set.size === 0) this.watchers.delete(projectId);
      if (this.watchers.size === 0) void this.stop();
    });
  }

  /** How many streams are open (the tests read it). */
  get open(): number {
    let count = 0;
    for (const set of this.watchers.values()) count += set.size;
    return count;
  }

  /** Whether the listening connection is open (the tests read it). */
  get listening(): boolean {
    return this.client !== null;
  }

  /** Ends every stream and the listening connection (shutdown). */
  async close(): Promise<void> {
    this.endAll();
    await this.stop();
  }

  private endAll(): void {
    for (const set of this.watchers.values()) for (const res of set) res.end();
    this.watchers.clear();
  }

  private async listen(): Promise<void> {
    if (this.client) return;
    this.connecting ??= (async () => {
      const client = new pg.Client(typeof this.connection === 'string' ? { connectionString: this.connection } : this.connection);
      client.on('notification', (message) => this.deliver(message.payload));
      client.on('error', (error) => {
        this.logger?.warn({ err: error }, 'the change listener lost its connection');
        // Watchers reconnect on their own (retry above) and so open a new listener.
        this.endAll();
        this.client = null;
      });
      await client.connect();
      await client.query(`LISTEN ${changeChannel}`);
      this.client = client;
      this.heartbeat = setInterval(() => {
        for (const set of this.watchers.values()) for (const res of set) res.write(': still here\n\n');
      }, heartbeatMs);
      this.heartbeat.unref();
    })().finally(() => {
      this.connecting = null;
    });
    await this.connecting;
  }

  private async stop(): Promise<void> {
    if (this.connecting) await this.connecting.catch(() => undefined);
    if (this.watchers.size > 0) return;
    if (this.heartbeat) clearInterval(this.heartbeat);
    this.heartbeat = null;
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }

  private deliver(payload: string | undefined): void {
    if (!payload) return;
    let change: ProjectChange;
    try {
      change = JSON.parse(payload) as ProjectChange;
    } catch {
      return;
    }
    const set = this.watchers.get(change.projectId);
    if (!set) return;
    const line = `event: change\ndata: ${JSON.stringify({ entity: change.entity, action: change.action })}\n\n`;
    for (const res of set) res.write(line);
  }
}
