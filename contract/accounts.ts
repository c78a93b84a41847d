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
  | 'review-digest'
  | 'invitation'
  | 'added-to-team';

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

export type InvitationRole = 'engineer' | 'reviewer' | 'contractor';

/** An invitation as the team panel lists it, until it is accepted or withdrawn. */
export interface InvitationView {
  id: string;
  email: string;
  role: InvitationRole;
  /** Who sent it; null when that account is gone. */
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  /** Past its expiry: the link no longer works; withdraw it and invite again. */
  expired: boolean;
}

/** What inviting an address did: an invitation for an address with no account, or the person added to the team. */
export type InvitationOutcome =
  | { outcome: 'invited'; invitation: InvitationView; invitations: InvitationView[] }
  | { outcome: 'added'; name: string; email: string; role: InvitationRole };

/** What the invitation page shows before the person chooses a name and password. */
export interface InvitationPreview {
  email: string;
  role: InvitationRole;
  projectName: string;
  invitedBy: string | null;
  expiresAt: string;
}

/** An accepted invitation: the new account is signed in, and the project to open. */
export interface InvitationAccepted {
  user: { id: string; email: string; name: string; isAdmin: boolean; roles: InvitationRole[] };
  csrfToken: string;
  projectId: string;
}

/** One change to an account, as the People page's "Changes to accounts" lists it. */
export interface AccountChange {
  id: string;
  at: string;
  /** Who made the change; null when that account is gone. */
  by: { id: string; name: string } | null;
  /** The account changed; null when it is gone. */
  account: { id: string; name: string; email: string } | null;
  /** `create`: an administrator made the account; `update`: administrator or disabled changed; `accept-invitation`: made by accepting an invitation. */
  action: 'create' | 'update' | 'accept-invitation';
  before: { isAdmin?: boolean; disabled?: boolean } | null;
  after: { isAdmin?: boolean; disabled?: boolean; role?: InvitationRole } | null;
  /** For an account made by accepting an invitation: the project it joined. */
  projectName?: string | null;
}
