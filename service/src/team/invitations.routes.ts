import bcrypt from 'bcryptjs';
import { Router } from 'express';
import type { Logger } from 'pino';
import { z } from 'zod';
import { passwordProblem } from '../auth/password-rules.js';
import { startSession, type SessionSettings } from '../auth/start-session.js';
import { textField, textLimits } from '../compliance/bounds.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { requestLimiter } from '../http/rate-limit.js';
import { currentSession } from '../http/session.js';
import { idParam, parse } from '../http/validate.js';
import { addedToTeamMail, invitationMail } from '../mail/messages.js';
import { queueMail } from '../mail/outbox.repository.js';
import type { InvitationAccepted, InvitationOutcome } from '../../../contract/accounts.js';
import {
  acceptInvitation,
  findInvitation,
  invite,
  listInvitations,
  withdrawInvitation,
  type InvitationState,
} from './invitations.repository.js';

export interface InvitationSettings {
  appUrl: string;
  /** How long an invitation's link works. */
  days: number;
  mailQueued: () => void;
}

const bcryptRounds = 12;
const inviteSchema = z.object({
  email: textField(textLimits.email, { required: true }).pipe(z.string().email('Enter a valid e-mail address.')),
  role: z.enum(['engineer', 'reviewer', 'contractor'], { message: 'Choose the role: engineer, reviewer or contractor.' }),
});
const acceptSchema = z.object({
  name: textField(textLimits.name, { required: true }),
  password: z.string().min(1, 'Choose a password.').max(200, 'Use at most 64 characters.'),
});

/** A project's invitations, under /api/projects/:projectId/invitations: members read; engineers and administrators invite and withdraw. */
export function projectInvitationsRouter(db: Database, settings: InvitationSettings): Router {
  const router = Router({ mergeParams: true });
  const read = requireProjectAction('read');
  const manage = requireProjectAction('manage-team');

  router.get('/invitations', read, async (req, res) => {
    res.json(await listInvitations(db, projectAccess(req).projectId));
  });

  router.post('/invitations', manage, async (req, res) => {
    const { projectId } = projectAccess(req);
    const input = parse(inviteSchema, req.body);
    const result = await db.transaction(async (trx) => {
      const done = await invite(trx, projectId, { ...input, actorId: currentSession(req).user.id, days: settings.days });
      if (done.outcome === 'invited') {
        const url = `${settings.appUrl}/invitation?token=${done.token}`;
        await queueMail(trx, {
          ...invitationMail(input.email, {
            inviter: done.inviter,
            projectName: done.projectName,
            role: input.role,
            days: settings.days,
            url,
          }),
          projectId,
        });
      } else {
        await queueMail(trx, {
          ...addedToTeamMail(done.user.email, done.user.name, {
            by: done.inviter,
            projectName: done.projectName,
            role: input.role,
            url: `${settings.appUrl}/projects/${projectId}`,
          }),
          projectId,
        });
      }
      return done;
    });
    settings.mailQueued();
    const answer: InvitationOutcome =
      result.outcome === 'invited'
        ? { outcome: 'invited', invitation: result.invitation, invitations: await listInvitations(db, projectId) }
        : { outcome: 'added', name: result.user.name, email: result.user.email, role: input.role };
    res.status(result.outcome === 'invited' ? 201 : 200).json(answer);
  });

  router.delete('/invitations/:invitationId', manage, async (req, res) => {
    const { projectId } = projectAccess(req);
    const id = idParam(req.params['invitationId'], 'That invitation');
    res.json(await withdrawInvitation(db, projectId, id, currentSession(req).user.id));
  });

  return router;
}

/** Why a link cannot be used, in words for the person who opened it. */
const refusals: Record<Exclude<InvitationState, 'open'> | 'unknown' | 'account-exists', AppError> = {
  unknown: new AppError(
    404,
    'invitation_not_found',
    'This invitation link is not one we sent. Open the whole link from the message, or ask the person who invited you to send a new one.',
  ),
  expired: new AppError(410, 'invitation_expired', 'This invitation has expired. Ask the person who invited you to send a new one.'),
  accepted: new AppError(410, 'invitation_used', 'This invitation was used already. Sign in with the account it made.'),
  withdrawn: new AppError(
    410,
    'invitation_withdrawn',
    'This invitation was withdrawn. Ask the project’s engineer if you should still join.',
  ),
  'account-exists': new AppError(
    409,
    'account_exists',
    'This address has an Allowlight account now. Sign in with it, and ask the project’s engineer to add you to the team.',
  ),
};

/** The link's token, bounded before it is hashed; anything longer than a token names none. */
function tokenParam(raw: unknown): string {
  const token = String(raw ?? '');
  if (token.length === 0 || token.length > 200) throw refusals.unknown;
  return token;
}

/**
 * Before sign-in, under /api/invitations: what a link invites to, and accepting it, which makes the
 * account, puts it on the team and signs it in.
 */
export function publicInvitationsRouter(db: Database, settings: SessionSettings & { logger: Logger }): Router {
  const router = Router();
  // Tokens cannot be guessed; the limit keeps anyone from spending the server's time on bcrypt.
  const limiter = requestLimiter({
    name: 'invitation-address',
    limit: 30,
    windowMinutes: 15,
    countFailuresOnly: true,
    message: 'Too many tries with invitation links. Wait a few minutes and try again.',
    logger: settings.logger,
  });

  router.get('/:token', limiter, async (req, res) => {
    const found = await findInvitation(db, tokenParam(req.params['token']));
    if (!found) throw refusals.unknown;
    if (found.state !== 'open') throw refusals[found.state];
    res.json(found.preview);
  });

  router.post('/:token/accept', limiter, async (req, res) => {
    const token = tokenParam(req.params['token']);
    const { name, password } = parse(acceptSchema, req.body);
    const found = await findInvitation(db, token);
    if (!found) throw refusals.unknown;
    if (found.state !== 'open') throw refusals[found.state];
    const problem = passwordProblem(password, [found.preview.email, name]);
    if (problem) throw AppError.badRequest(problem, [{ path: 'password', message: problem }]);
    const passwordHash = await bcrypt.hash(password, bcryptRounds);
    const result = await db.transaction((trx) => acceptInvitation(trx, token, { name, passwordHash }));
    if (!result.accepted) throw refusals[result.state];
    const session = await startSession(db, req, res, result.user, settings);
    const answer: InvitationAccepted = { ...session, projectId: result.projectId };
    res.status(201).json(answer);
  });

  return router;
}
