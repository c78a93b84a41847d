import type { Logger } from 'pino';
import type { Config } from '../config.js';
import type { Database } from '../db/database.js';
import { claimDigestDay, digestRecipients, digestRows, recordDigestMail } from './digest.repository.js';
import { reviewDigestMail } from './messages.js';
import { queueMail } from './outbox.repository.js';

export interface DigestSettings {
  appUrl: string;
  /** The local hour (0–23) from which each day's digest goes out. */
  hour: number;
  /** The IANA time zone the day and the hour are counted in. */
  timeZone: string;
  /** How often the job looks whether a digest is due. */
  checkMs: number;
  /** The clock; the tests set their own. */
  now?: () => Date;
}

export function digestSettingsFrom(config: Config): DigestSettings {
  return {
    appUrl: config.APP_URL,
    hour: config.REVIEW_DIGEST_HOUR,
    timeZone: config.REVIEW_DIGEST_TIME_ZONE,
    checkMs: config.REVIEW_DIGEST_CHECK_MINUTES * 60_000,
  };
}

/** The calendar day (YYYY-MM-DD) and the hour of a moment in a time zone. */
export function localTime(at: Date, timeZone: string): { day: string; hour: number } {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((entry) => entry.type === type)?.value ?? '';
  return { day: `${part('year')}-${part('month')}-${part('day')}`, hour: Number(part('hour')) };
}

/** Whole calendar days from one local day to a later one. */
function daysBetween(from: string, to: string): number {
  return Math.max(0, Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000));
}

/**
 * Once per local day, from the configured hour on, queues for each person who chose it one message
 * listing the projects waiting for their review. A day with nothing waiting is claimed too and
 * sends nothing: a project submitted later that day has already been announced by its own message.
 */
export class ReviewDigest {
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<number> | null = null;
  private readonly now: () => Date;

  constructor(
    private readonly db: Database,
    private readonly settings: DigestSettings,
    private readonly mailQueued: () => void = () => {},
    private readonly logger?: Logger,
  ) {
    this.now = settings.now ?? (() => new Date());
  }

  start(): void {
    if (this.timer) return;
    this.timer = setInterval(() => void this.tick(), this.settings.checkMs);
    this.timer.unref();
    void this.tick();
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.running;
  }

  private async tick(): Promise<void> {
    if (this.running) return;
    this.running = this.run();
    try {
      await this.running;
    } catch (error) {
      this.logger?.error({ err: error }, 'the review digest could not be prepared');
    } finally {
      this.running = null;
    }
  }

  /** Queues the digests due now; resolves with how many were queued (the tests call it directly). */
  async run(): Promise<number> {
    const at = this.now();
    const { day, hour } = localTime(at, this.settings.timeZone);
    if (hour < this.settings.hour) return 0;
    let queued = 0;
    for (const person of await digestRecipients(this.db)) {
      const sent = await this.db.transaction(async (trx) => {
        if (!(await claimDigestDay(trx, person.id, day))) return false;
        const rows = await digestRows(trx, person.id);
        if (rows.length === 0) return false;
        const lines = rows.map((row) => ({
          projectName: row.name,
          waitingDays: daysBetween(localTime(row.submittedAt, this.settings.timeZone).day, day),
          open: row.open,
          needsRevision: row.needsRevision,
          url: `${this.settings.appUrl}/projects/${encodeURIComponent(row.projectId)}/review`,
        }));
        const mailId = await queueMail(trx, reviewDigestMail(person.email, person.name, lines, `${this.settings.appUrl}/account`));
        await recordDigestMail(trx, person.id, day, mailId);
        return true;
      });
      if (sent) queued += 1;
    }
    if (queued > 0) {
      this.mailQueued();
      this.logger?.info({ day, queued }, 'review digests queued');
    }
    return queued;
  }
}
