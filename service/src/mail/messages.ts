import type { OutgoingMail } from './outbox.repository.js';

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escapeHtml = (text: string): string => text.replace(/[&<>"']/g, (character) => escapes[character] ?? character);

/** One message in text and HTML from the same paragraphs, with at most one link, in our words. */
function compose(
  kind: OutgoingMail['kind'],
  to: string,
  subject: string,
  paragraphs: string[],
  link?: { label: string; url: string },
): OutgoingMail {
  const text = [...paragraphs, ...(link ? [`${link.label}: ${link.url}`] : []), '— Allowlight'].join('\n\n');
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">',
    // A comment keeps the line breaks its writer typed.
    ...paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph).replace(/\r?\n/g, '<br>')}</p>`),
    ...(link ? [`<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`] : []),
    '<p>— Allowlight</p></body></html>',
  ].join('\n');
  return { kind, to: [to], subject: subjectLine(subject), text, html };
}

/** The outbox keeps 300 characters of a subject; a header has no place for a line break. */
function subjectLine(subject: string): string {
  const line = subject.replace(/\s+/g, ' ').trim();
  return line.length <= 300 ? line : `${line.slice(0, 299)}…`;
}

export function passwordResetMail(to: string, name: string, url: string, minutes: number): OutgoingMail {
  return compose(
    'password-reset',
    to,
    'Choose a new Allowlight password',
    [
      `Hello ${name},`,
      `Someone (we hope you) asked to choose a new password for the Allowlight account of ${to}. The link below works once, for the next ${minutes} minutes. Choosing a new password signs the account out everywhere.`,
      'If you did not ask for this, you can ignore this message: your password stays as it is.',
    ],
    { label: 'Choose a new password', url },
  );
}

export function passwordChangedMail(to: string, name: string, signInUrl: string): OutgoingMail {
  return compose(
    'password-changed',
    to,
    'Your Allowlight password was changed',
    [
      `Hello ${name},`,
      `The password of the Allowlight account of ${to} was just changed, and the account's other sessions were ended.`,
      'If you did not change it, ask for a new password from the sign-in page at once and tell your administrator.',
    ],
    { label: 'Sign in', url: signInUrl },
  );
}

export function accountCreatedMail(to: string, name: string, url: string, days: number): OutgoingMail {
  return compose(
    'account-created',
    to,
    'Your Allowlight account',
    [
      `Hello ${name},`,
      `An administrator made you an Allowlight account for ${to}. Choose your password with the link below; it works once, for the next ${days} days. After that, ask for a new link from the sign-in page ("Forgot your password?").`,
    ],
    { label: 'Choose your password', url },
  );
}

/** Who gets a review message and which page their link opens. */
export interface ReviewMailRecipient {
  email: string;
  name: string;
  /** The page of the product the message links to: the project's, or its review page. */
  url: string;
  linkLabel: string;
}

/** What happened to the project, as each review message tells it. */
export interface ReviewEvent {
  kind: Extract<OutgoingMail['kind'], 'review-submitted' | 'review-returned' | 'review-accepted' | 'project-issued' | 'project-reopened'>;
  projectId: string;
  projectName: string;
  /** The person who made the move. */
  by: string;
  /** The revision the project is at after the move. */
  revision: number;
  /** A resubmission after a return. */
  again?: boolean;
  comment?: string;
}

function reviewWords(event: ReviewEvent): { subject: string; paragraphs: string[] } {
  const project = event.projectName;
  const revision = `revision ${event.revision}`;
  const comment = event.comment ? [`${event.by} wrote:`, event.comment] : [];
  switch (event.kind) {
    case 'review-submitted':
      return {
        subject: `Ready for your review: ${project}`,
        paragraphs: [
          event.again
            ? `${event.by} submitted ${project} (${revision}) for review again, after it was returned for changes.`
            : `${event.by} submitted ${project} (${revision}) for review.`,
          'Its design cannot change while it is in review: return it with your comments, or accept it.',
        ],
      };
    case 'review-returned':
      return {
        subject: `Returned for changes: ${project}`,
        paragraphs: [
          `${event.by} reviewed ${project} (${revision}) and returned it for changes.`,
          ...comment,
          'The design can be changed again. Submit it for review once the changes are made.',
        ],
      };
    case 'review-accepted':
      return {
        subject: `Accepted: ${project}`,
        paragraphs: [
          `${event.by} reviewed ${project} (${revision}) and accepted it.`,
          ...comment,
          'The accepted design stays as it is; to change it, reopen it as a draft, which starts a new revision.',
        ],
      };
    case 'project-issued':
      return {
        subject: `Issued: ${project}`,
        paragraphs: [`${event.by} issued ${project} (${revision}).`, ...comment],
      };
    case 'project-reopened':
      return {
        subject: `Reopened as a draft: ${project}`,
        paragraphs: [
          `${event.by} reopened ${project} as a draft. It is now ${revision}, and its design can change again.`,
          ...comment,
          'It comes back to you for review when it is submitted.',
        ],
      };
  }
}

/** One message of the review loop for one person: addresses are never shared between recipients. */
export function reviewEventMail(recipient: ReviewMailRecipient, event: ReviewEvent): OutgoingMail {
  const { subject, paragraphs } = reviewWords(event);
  return {
    ...compose(event.kind, recipient.email, subject, [`Hello ${recipient.name},`, ...paragraphs], {
      label: recipient.linkLabel,
      url: recipient.url,
    }),
    projectId: event.projectId,
  };
}

/** One project of a reviewer's digest. */
export interface DigestLine {
  projectName: string;
  /** Whole days since it was last submitted. */
  waitingDays: number;
  /** Check items without a verdict yet, and those that need revision. */
  open: number;
  needsRevision: number;
  url: string;
}

const items = (count: number, what: string): string => `${count} check item${count === 1 ? '' : 's'} ${what}`;
/** "12 check items to check, 1 needs revision", or that nothing is left to check. */
const itemWords = (line: DigestLine): string =>
  [
    line.open > 0 ? items(line.open, 'to check') : 'every check item has a verdict',
    ...(line.needsRevision > 0 ? [items(line.needsRevision, line.needsRevision === 1 ? 'needs revision' : 'need revision')] : []),
  ].join(', ');

const waited = (days: number): string =>
  days < 1 ? 'submitted today' : days === 1 ? 'waiting since yesterday' : `waiting for ${days} days`;

/** The daily list of projects waiting for one reviewer. Every project carries its own link, so the list is built here. */
export function reviewDigestMail(to: string, name: string, lines: DigestLine[], accountUrl: string): OutgoingMail {
  const count = lines.length === 1 ? 'One project waits' : `${lines.length} projects wait`;
  const subject = `${count} for your review`;
  const intro = [`Hello ${name},`, `${count} for your review:`];
  const outro = 'You receive this list once a day because you chose it on your Account page, where you can also turn it off.';
  const text = [
    ...intro,
    lines.map((line) => `- ${line.projectName}, ${waited(line.waitingDays)}; ${itemWords(line)}: ${line.url}`).join('\n'),
    outro,
    `Your account: ${accountUrl}`,
    '— Allowlight',
  ].join('\n\n');
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">',
    ...intro.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`),
    '<ul>',
    ...lines.map(
      (line) =>
        `<li><a href="${escapeHtml(line.url)}">${escapeHtml(line.projectName)}</a>, ${escapeHtml(waited(line.waitingDays))}; ${escapeHtml(itemWords(line))}</li>`,
    ),
    '</ul>',
    `<p>${escapeHtml(outro)}</p>`,
    `<p><a href="${escapeHtml(accountUrl)}">Your account</a></p>`,
    '<p>— Allowlight</p></body></html>',
  ].join('\n');
  return { kind: 'review-digest', to: [to], subject, text, html };
}

/** A name in a subject line, which the outbox keeps to 300 characters. */
const clipped = (text: string): string => (text.length > 100 ? `${text.slice(0, 99)}…` : text);

const roleWords: Record<string, string> = {
  engineer: 'an engineer',
  reviewer: 'a reviewer',
  contractor: 'a contractor',
};

export function invitationMail(
  to: string,
  invitation: { inviter: string; projectName: string; role: string; days: number; url: string },
): OutgoingMail {
  const role = roleWords[invitation.role] ?? 'a member';
  return compose(
    'invitation',
    to,
    `${clipped(invitation.inviter)} invites you to ${clipped(invitation.projectName)} on Allowlight`,
    [
      'Hello,',
      `${invitation.inviter} invites you to join the team of the project “${invitation.projectName}” on Allowlight as ${role}. Allowlight checks a building's lighting design against the energy code.`,
      `Open the link below to choose your name and a password; that makes your account and opens the project. The link works once, for the next ${invitation.days} days.`,
      'If you did not expect this, you can ignore this message: no account is made.',
    ],
    { label: 'Accept the invitation', url: invitation.url },
  );
}

export function addedToTeamMail(
  to: string,
  name: string,
  added: { by: string; projectName: string; role: string; url: string },
): OutgoingMail {
  return compose(
    'added-to-team',
    to,
    `You are on the team of ${clipped(added.projectName)}`,
    [
      `Hello ${name},`,
      `${added.by} added you to the team of the project “${added.projectName}” on Allowlight as ${roleWords[added.role] ?? 'a member'}.`,
    ],
    { label: 'Open the project', url: added.url },
  );
}
