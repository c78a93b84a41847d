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
    ...paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`),
    ...(link ? [`<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`] : []),
    '<p>— Allowlight</p></body></html>',
  ].join('\n');
  return { kind, to: [to], subject, text, html };
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
