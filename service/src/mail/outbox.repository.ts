import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { MailKind, MailStatus, OutboxEntry, OutboxMessage } from '../../../contract/accounts.js';

export type { MailKind, MailStatus, OutboxEntry, OutboxMessage };

export interface OutgoingMail {
  kind: MailKind;
  to: string[];
  subject: string;
  text: string;
  html: string;
  projectId?: string | null;
}

export interface OutboxRow {
  id: string;
  kind: MailKind;
  recipients: string[];
  subject: string;
  text_body: string;
  html_body: string;
  project_id: string | null;
  status: MailStatus;
  attempts: number;
  next_attempt_at: Date;
  last_error: string | null;
  created_at: Date;
  sent_at: Date | null;
}

/**
 * Queues a message in the caller's transaction: it is sent only if the change it reports commits,
 * and the change commits whether or not the mail server answers.
 */
export async function queueMail(db: Database | Knex.Transaction, mail: OutgoingMail): Promise<string> {
  const [row] = await db('mail_outbox')
    .insert({
      kind: mail.kind,
      recipients: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html,
      project_id: mail.projectId ?? null,
    })
    .returning('id');
  return (row as { id: string }).id;
}

function toEntry(row: OutboxRow): OutboxEntry {
  return {
    id: row.id,
    kind: row.kind,
    to: row.recipients,
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    createdAt: row.created_at.toISOString(),
    sentAt: row.sent_at?.toISOString() ?? null,
    nextAttemptAt: row.status === 'queued' ? row.next_attempt_at.toISOString() : null,
    lastError: row.last_error,
  };
}

export async function listOutbox(db: Database, limit: number): Promise<OutboxEntry[]> {
  const rows: OutboxRow[] = await db('mail_outbox')
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .limit(limit);
  return rows.map(toEntry);
}

export async function findOutboxMessage(db: Database, id: string): Promise<OutboxMessage | null> {
  const row: OutboxRow | undefined = await db('mail_outbox').where({ id }).first();
  return row ? { ...toEntry(row), text: row.text_body, html: row.html_body } : null;
}

/**
 * Takes the next due message and keeps its row locked for the length of `send`: a second worker
 * skips it, so a message is handed to SMTP once. Only messages due by `dueBy` are taken, so one that
 * just failed waits for its retry. Returns false when nothing was due.
 */
export async function sendNextDue(
  db: Database,
  dueBy: Date,
  send: (row: OutboxRow) => Promise<void>,
  retry: { maxAttempts: number; delayAfter: (attempts: number) => number },
): Promise<boolean> {
  return db.transaction(async (trx) => {
    const row: OutboxRow | undefined = await trx('mail_outbox')
      .where({ status: 'queued' })
      .andWhere('next_attempt_at', '<=', dueBy)
      .orderBy('next_attempt_at')
      .forUpdate()
      .skipLocked()
      .first();
    if (!row) return false;
    const attempts = row.attempts + 1;
    try {
      await send(row);
      await trx('mail_outbox').where({ id: row.id }).update({ status: 'sent', attempts, sent_at: trx.fn.now(), last_error: null });
    } catch (error) {
      const reason = (error instanceof Error ? error.message : String(error)).slice(0, 1000);
      const failed = attempts >= retry.maxAttempts;
      await trx('mail_outbox')
        .where({ id: row.id })
        .update({
          status: failed ? 'failed' : 'queued',
          attempts,
          last_error: reason,
          next_attempt_at: new Date(Date.now() + retry.delayAfter(attempts)),
        });
    }
    return true;
  });
}
