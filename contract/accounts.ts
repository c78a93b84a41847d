/** What the administrator's routes answer, read by the service and the web app alike. */

export type MailStatus = 'queued' | 'sent' | 'failed';
export type MailKind =
  | 'password-reset'
  | 'password-changed'
  | 'account-created'
  | 'review-submitted'
  | 'review-returned'
  | 'review-accepted'
  | 'project-issued'
  | 'project-reopened'
  | 'review-digest';

/** One message of the outbox as the Outbox page lists it: no bodies, which the detail carries. */
export interface OutboxEntry {
  id: string;
  kind: MailKind;
  to: string[];
  subject: string;
  status: MailStatus;
  attempts: number;
  createdAt: string;
  sentAt: string | null;
  nextAttemptAt: string | null;
  /** What the mail server last answered when it did not take the message. */
  lastError: string | null;
}

export interface OutboxMessage extends OutboxEntry {
  text: string;
  html: string;
}

/** An account as the People page shows it. */
export interface AccountView {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  disabled: boolean;
  createdAt: string;
}

/** `GET` and `PATCH /api/auth/mail-settings`: which optional mail the signed-in person receives. */
export interface MailSettingsView {
  /** A daily message listing the projects waiting for the person's review; off unless chosen. */
  reviewDigest: boolean;
}
