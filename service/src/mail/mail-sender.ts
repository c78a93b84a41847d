import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Config } from '../config.js';
import type { Database } from '../db/database.js';
import { sendNextDue, type OutboxRow } from './outbox.repository.js';

export interface MailSettings {
  host: string;
  port: number;
  /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  user?: string | undefined;
  password?: string | undefined;
  from: string;
  /** The first retry waits this long; each further one twice as long, up to an hour. */
  retryBaseMs: number;
  maxAttempts: number;
  pollMs: number;
}

const longestRetryMs = 3_600_000;

export function mailSettingsFrom(config: Config): MailSettings {
  return {
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    user: config.SMTP_USER,
    password: config.SMTP_PASSWORD,
    from: config.MAIL_FROM,
    retryBaseMs: config.MAIL_RETRY_SECONDS * 1000,
    maxAttempts: config.MAIL_MAX_ATTEMPTS,
    pollMs: config.MAIL_POLL_SECONDS * 1000,
  };
}

/**
 * Sends what the outbox holds: on a timer, and at once when told a message was queued. A message
 * that SMTP refuses or cannot take is retried with back-off; after `maxAttempts` it shows as failed.
 */
export class MailSender {
  private readonly transport: Transporter;
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<void> | null = null;
  private again = false;

  constructor(
    private readonly db: Database,
    private readonly settings: MailSettings,
    private readonly logger?: Logger,
  ) {
    this.transport = nodemailer.createTransport({
      host: settings.host,
      port: settings.port,
      secure: settings.secure,
      ...(settings.user ? { auth: { user: settings.user, pass: settings.password ?? '' } } : {}),
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }

  start(): void {
    if (this.timer) return;
    this.timer = setInterval(() => this.kick(), this.settings.pollMs);
    this.timer.unref();
    this.kick();
  }

  /** A message was queued: send now rather than at the next tick. */
  kick(): void {
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.drain().finally(() => {
      this.running = null;
      if (this.again) {
        this.again = false;
        this.kick();
      }
    });
  }

  /** Sends every due message; resolves when none is left (the tests' way to wait for the mail). */
  async drain(): Promise<void> {
    const startedAt = new Date();
    try {
      while (
        await sendNextDue(this.db, startedAt, (row) => this.send(row), {
          maxAttempts: this.settings.maxAttempts,
          delayAfter: (attempts) => this.delayAfter(attempts),
        })
      ) {
        // next one
      }
    } catch (error) {
      this.logger?.error({ err: error }, 'the mail outbox could not be read');
    }
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.running;
    this.transport.close();
  }

  private delayAfter(attempts: number): number {
    return Math.min(this.settings.retryBaseMs * 2 ** (attempts - 1), longestRetryMs);
  }

  private async send(row: OutboxRow): Promise<void> {
    await this.transport.sendMail({
      from: this.settings.from,
      to: row.recipients,
      subject: row.subject,
      text: row.text_body,
      html: row.html_body,
      // The outbox id: a relay or reader that sees the same message twice can tell.
      messageId: `<${row.id}@allowlight.outbox>`,
    });
    this.logger?.info({ mail: row.id, kind: row.kind }, 'mail sent');
  }
}
