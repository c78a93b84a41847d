import type { Knex } from 'knex';
import type { ProjectState } from '../../../contract/review.js';
import type { ProjectRole } from '../db/tables.js';
import { reviewEventMail, type ReviewEvent } from '../mail/messages.js';
import { queueMail } from '../mail/outbox.repository.js';

/** Where the links of the review mail point: the address people reach the app at (`APP_URL`). */
export interface TransitionMailSettings {
  appUrl: string;
}

export interface TransitionMailInput {
  projectId: string;
  from: ProjectState;
  to: ProjectState;
  revision: number;
  /** The person who made the move; never mailed about it. */
  actorId: string;
  comment?: string;
}

/** Who hears of each move: the side that has to act next, and everyone once the design is issued. */
const audience: Record<ProjectState, { kind: ReviewEvent['kind']; roles: readonly ProjectRole[] }> = {
  'in-review': { kind: 'review-submitted', roles: ['reviewer'] },
  returned: { kind: 'review-returned', roles: ['engineer', 'contractor'] },
  accepted: { kind: 'review-accepted', roles: ['engineer', 'contractor'] },
  issued: { kind: 'project-issued', roles: ['engineer', 'reviewer', 'contractor'] },
  draft: { kind: 'project-reopened', roles: ['reviewer'] },
};

interface Recipient {
  id: string;
  email: string;
  name: string;
  role: ProjectRole;
}

/**
 * Queues the messages a move sends, in the move's transaction: they go out only if it commits, and it
 * commits whether or not the mail server answers. One message per person, so no one sees the others'
 * addresses. The person who made the move is left out even when nobody else is left: they saw the
 * move happen, and a message to themselves would only repeat it. Disabled accounts get nothing.
 * Returns how many messages were queued.
 */
export async function queueTransitionMail(
  trx: Knex.Transaction,
  input: TransitionMailInput,
  settings: TransitionMailSettings,
): Promise<number> {
  const { kind, roles } = audience[input.to];
  const project = await trx('projects').where({ id: input.projectId }).first<{ name: string } | undefined>('name');
  const actor = await trx('users').where({ id: input.actorId }).first('name');
  if (!project) return 0;
  const recipients: Recipient[] = await trx('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', input.projectId)
    .whereIn('m.role', roles)
    .whereNull('u.disabled_at')
    .whereNot('u.id', input.actorId)
    .orderBy('u.email')
    .select('u.id', 'u.email', 'u.name', 'm.role');
  const event: ReviewEvent = {
    kind,
    projectId: input.projectId,
    projectName: project.name,
    by: actor?.name ?? 'Someone',
    revision: input.revision,
    again: input.to === 'in-review' && input.from === 'returned',
    ...(input.comment ? { comment: input.comment } : {}),
  };
  const projectUrl = `${settings.appUrl}/projects/${encodeURIComponent(input.projectId)}`;
  for (const person of recipients) {
    const reviewing = person.role === 'reviewer';
    await queueMail(
      trx,
      reviewEventMail(
        {
          email: person.email,
          name: person.name,
          url: reviewing ? `${projectUrl}/review` : projectUrl,
          linkLabel: reviewing ? 'Open the review' : 'Open the project',
        },
        event,
      ),
    );
  }
  return recipients.length;
}
